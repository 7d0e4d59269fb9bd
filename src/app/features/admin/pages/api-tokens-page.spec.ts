import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialog } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';

import type { ApiTokenRow, IssuedApiToken } from '../../../../../shared/api/api-token-answers.js';
import type { UserRow } from '../../../../../shared/api/auth.js';
import { ApiTokensPage } from './api-tokens-page';

const row = (over: Partial<ApiTokenRow>): ApiTokenRow => ({
  id: 1,
  userId: 7,
  userEmail: 'ilse.marrow@demo.test',
  userName: 'Ilse Marrow',
  label: 'Genebank sync',
  prefix: 'hlb_Ab12Cd',
  createdAt: '2026-11-02T08:00:00.000Z',
  createdByEmail: 'admin@demo.test',
  lastUsedAt: null,
  revokedAt: null,
  ...over,
});

const user: UserRow = { id: 7, email: 'ilse.marrow@demo.test', name: 'Ilse Marrow', role: 'reviewer', active: true, createdAt: '2026-01-01T00:00:00.000Z', lastLoginAt: null };

describe('ApiTokensPage', () => {
  let http: HttpTestingController;
  let host: HTMLElement;

  async function settle(): Promise<void> {
    await new Promise((r) => setTimeout(r));
    TestBed.tick();
  }

  const buttonIn = (root: ParentNode, name: RegExp) => Array.from(root.querySelectorAll('button')).find((b) => name.test(b.textContent ?? '')) as HTMLButtonElement;
  const pane = () => document.querySelector('.cdk-overlay-pane:last-of-type') as HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ApiTokensPage);
    host = fixture.nativeElement as HTMLElement;
    await settle();
    http.expectOne('/api/api-tokens').flush([row({ id: 2, label: 'Old laptop', revokedAt: '2026-11-20T10:00:00.000Z' }), row({})]);
    await settle();
  });

  afterEach(() => {
    TestBed.inject(MatDialog).closeAll();
    http.verify();
  });

  it('should list every token by label, person and prefix, with its state, and never a secret', () => {
    const items = Array.from(host.querySelectorAll('li.token'));
    expect(items.length).toBe(2);
    expect(items[0]!.textContent).toContain('Old laptop');
    expect(items[0]!.textContent).toContain('Revoked');
    expect(items[1]!.textContent).toContain('hlb_Ab12Cd…');
    expect(items[1]!.textContent).toContain('never used');
    expect(buttonIn(items[1]!, /Revoke/)).toBeTruthy();
    expect(host.textContent).toContain('/brapi/v2');
  });

  it('should issue a token for the chosen person and show it once', async () => {
    buttonIn(host, /Issue token/).click();
    await settle();
    http.expectOne('/api/users').flush([user, { ...user, id: 8, name: 'Gone Person', active: false }]);
    await settle();
    const dialog = pane();
    (dialog.querySelector('.mat-mdc-select-trigger') as HTMLElement).click();
    await settle();
    const options = Array.from(document.querySelectorAll('mat-option'));
    expect(options.map((o) => o.textContent?.trim())).toEqual(['Ilse Marrow (ilse.marrow@demo.test, reviewer)']);
    (options[0] as HTMLElement).click();
    const label = dialog.querySelector('input') as HTMLInputElement;
    label.value = 'Field tablet';
    label.dispatchEvent(new Event('input'));
    buttonIn(dialog, /Issue token/).click();
    await settle();
    const post = http.expectOne({ method: 'POST', url: '/api/api-tokens' });
    expect(post.request.body).toEqual({ userId: 7, label: 'Field tablet' });
    const issued: IssuedApiToken = { ...row({ id: 3, label: 'Field tablet', prefix: 'hlb_Zz99Yy' }), token: 'hlb_Zz99Yy-the-whole-secret' };
    post.flush(issued);
    await settle();
    http.expectOne('/api/api-tokens').flush([row({ id: 3, label: 'Field tablet', prefix: 'hlb_Zz99Yy' })]);
    await settle();
    expect(host.querySelector('[data-testid="issued-token"]')?.textContent).toBe('hlb_Zz99Yy-the-whole-secret');
    buttonIn(host, /Done/).click();
    await settle();
    expect(host.querySelector('[data-testid="issued-token"]')).toBeNull();
  });

  it('should revoke a token after confirmation and show it revoked', async () => {
    buttonIn(host.querySelectorAll('li.token')[1]!, /Revoke/).click();
    await settle();
    expect(pane().textContent).toContain('cannot be undone');
    buttonIn(pane(), /^\s*Revoke\s*$/).click();
    await settle();
    http.expectOne({ method: 'POST', url: '/api/api-tokens/1/revoke' }).flush(row({ revokedAt: '2026-12-02T22:00:00.000Z' }));
    await settle();
    const items = Array.from(host.querySelectorAll('li.token'));
    expect(items[1]!.textContent).toContain('Revoked');
    expect(buttonIn(items[1]!, /Revoke$/)).toBeUndefined();
  });
});
