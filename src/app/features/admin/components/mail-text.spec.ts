import { TestBed } from '@angular/core/testing';

import { MailText } from './mail-text';

describe('MailText', () => {
  function render(text: string): HTMLElement {
    const fixture = TestBed.createComponent(MailText);
    fixture.componentRef.setInput('text', text);
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  it('should show the text exactly, without added whitespace', () => {
    const text = 'Hello Ana,\n\n  Open http://localhost:3000/invitation/tok_123 to join.\n';
    expect(render(text).querySelector('pre')?.textContent).toBe(text);
  });

  it('should make the address a link to itself', () => {
    const link = render('See https://example.test/reset-password/abc now').querySelector('a');
    expect(link?.getAttribute('href')).toBe('https://example.test/reset-password/abc');
  });

  it('should show markup in the mail as text, not as elements', () => {
    const element = render('<img src=x onerror="alert(1)"> hi');
    expect(element.querySelector('img')).toBeNull();
    expect(element.textContent).toContain('<img src=x');
  });
});
