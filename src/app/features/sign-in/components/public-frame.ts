import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { RouterLink } from '@angular/router';

/** The frame of the pages people see before signing in: brand, a heading, one card of content. */
@Component({
  selector: 'hl-public-frame',
  imports: [RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <header class="bar">
      <a class="brand" routerLink="/sign-in">
        <img src="favicon.svg" alt="" width="32" height="32" />
        <span>Hueledger</span>
      </a>
    </header>
    <main class="card">
      <h1>{{ heading() }}</h1>
      <ng-content />
    </main>
  `,
  styles: `
    :host {
      display: block;
      min-height: 100%;
      background: var(--mat-sys-surface-container-low);
    }
    .bar {
      background: var(--hl-leaf-deep);
      color: #fff;
      padding: 8px 16px;
    }
    .brand {
      display: inline-flex;
      align-items: center;
      gap: 10px;
      min-height: 48px;
      color: inherit;
      text-decoration: none;
      font: var(--mat-sys-title-large);
      font-weight: 600;
    }
    .card {
      box-sizing: border-box;
      max-width: 460px;
      margin: 24px auto;
      padding: 24px 20px;
      background: var(--mat-sys-surface);
      border-radius: 16px;
      border: 1px solid var(--mat-sys-outline-variant);
    }
    h1 {
      font: var(--mat-sys-headline-small);
      margin: 0 0 16px;
    }
    @media (max-width: 599px) {
      :host {
        background: var(--mat-sys-surface);
      }
      .card {
        margin: 0;
        border-radius: 0;
        border: none;
      }
    }
  `,
})
export class PublicFrame {
  /** The page's heading. */
  readonly heading = input.required<string>();
}
