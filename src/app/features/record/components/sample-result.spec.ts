import { TestBed } from '@angular/core/testing';

import type { PhotoSample } from '../../../../../shared/api/photo-answers.js';
import { SampleResult } from './sample-result';

function sample(overrides: Partial<PhotoSample> = {}): PhotoSample {
  return {
    photoId: 1,
    region: { shape: 'rect', x: 0, y: 0, width: 10, height: 10 },
    lab: [32.1, 30.4, -12.25],
    lch: [32.1, 32.8, 338],
    hex: '#6b2d5c',
    inGamut: true,
    pixelCount: 6400,
    pixelsDropped: 120,
    clipped: 100,
    dark: 20,
    spreadDeltaE00: 1.2,
    spreadPixels: 5000,
    uniform: true,
    clusters: [],
    correction: { kind: 'none' },
    matches: [
      { code: 'F-150.004', parent: 'F-150', name: 'plum L32 C32', hex: '#6a2e5b', lab: [32, 30, -12], deltaE00: 0.4, verdict: 'indistinguishable' },
      { code: 'F-150.005', parent: 'F-150', name: 'plum L32 C32', hex: '#6e2c5e', lab: [33, 32, -12], deltaE00: 2.3, verdict: 'clearly different' },
    ],
    between: { a: 'F-150.004', b: 'F-150.005', t: 0.2 },
    setId: 'v1',
    pipeline: 'photo-sample/1',
    ...overrides,
  };
}

function render(s: PhotoSample): HTMLElement {
  const fixture = TestBed.createComponent(SampleResult);
  fixture.componentRef.setInput('sample', s);
  fixture.detectChanges();
  return fixture.nativeElement as HTMLElement;
}

describe('SampleResult', () => {
  it('should show the numbers with a true minus, the chip codes, ΔE00 and verdict words', () => {
    const text = (render(sample()).textContent ?? '').replace(/\s+/g, ' ');
    expect(text).toContain('32.1');
    expect(text).toContain('−12.3');
    expect(text).toContain('F-150.004');
    expect(text).toContain('ΔE00 0.4');
    expect(text).toContain('indistinguishable');
    expect(text).toContain('clearly different');
    expect(text).toContain('Between F-150.004 and F-150.005, nearer F-150.004.');
    expect(text).toContain('100 glare, 20 too dark');
  });

  it('should say in words, not only colour, when the region is not even', () => {
    const text = render(sample({ uniform: false, spreadDeltaE00: 6.4 })).textContent ?? '';
    expect(text).toContain('Not even.');
    expect(text).toContain('6.4');
  });

  it('should put every swatch on the neutral grey surround', () => {
    const el = render(sample());
    const swatches = el.querySelectorAll('.swatch, .chip-swatch');
    expect(swatches.length).toBe(3);
    swatches.forEach((s) => expect(s.parentElement?.classList).toContain('hl-swatch-surround'));
  });

  it('should say when the swatch stands in for a colour outside the screen', () => {
    expect(render(sample({ inGamut: false })).textContent).toContain('outside what a screen shows');
  });

  it('should show each colour of a region that is not even, with its share and chip', () => {
    const stripe = {
      lab: [32, 30, -12] as [number, number, number],
      lch: [32, 32.3, 338] as [number, number, number],
      hex: '#6b2d5c',
      inGamut: true,
      spreadDeltaE00: 0.3,
    };
    const chipOf = (code: string) => ({ code, parent: 'F-150', name: 'plum L32 C32', hex: '#6a2e5b', lab: [32, 30, -12] as [number, number, number], deltaE00: 0.4, verdict: 'indistinguishable' as const });
    const el = render(sample({ uniform: false, spreadDeltaE00: 12, clusters: [{ ...stripe, hex: '#4f7a28', share: 0.75, chip: chipOf('F-300.010') }, { ...stripe, share: 0.25, chip: chipOf('F-150.004') }] }));
    const section = el.querySelector('[data-testid=clusters]')!;
    expect(section.textContent).toContain('2 colours in this region');
    const items = [...section.querySelectorAll('li')].map((li) => li.textContent!.replace(/\s+/g, ' '));
    expect(items[0]).toContain('F-300.010');
    expect(items[0]).toContain('75 % of the region');
    expect(items[1]).toContain('25 % of the region');
  });

  it('should show no colour list for an even region', () => {
    expect(render(sample()).querySelector('[data-testid=clusters]')).toBeNull();
  });
});
