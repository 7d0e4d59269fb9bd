import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { linkify } from '../data/linkify';

/**
 * A mail's plain text with its http(s) addresses as links. The text is bound as text, never as
 * HTML, so nothing in a mail can run or restyle the page. Kept on one line: a <pre> keeps
 * template whitespace.
 */
@Component({
  selector: 'hl-mail-text',
  changeDetection: ChangeDetectionStrategy.OnPush,
  // prettier-ignore
  template: `<pre class="mail-text">@for (part of parts(); track $index) {@if (part.kind === 'link') {<a [href]="part.href" target="_blank" rel="noopener noreferrer">{{ part.text }}</a>} @else {<span>{{ part.text }}</span>}}</pre>`,
  styles: `
    .mail-text {
      margin: 0;
      padding: 16px;
      white-space: pre-wrap;
      overflow-wrap: anywhere;
      font: var(--mat-sys-body-medium);
      font-family: ui-monospace, 'Cascadia Mono', 'DejaVu Sans Mono', monospace;
      background: var(--mat-sys-surface-container-lowest);
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 8px;
    }
    a {
      color: var(--mat-sys-primary);
      text-decoration: underline;
      min-height: 24px;
    }
  `,
})
export class MailText {
  /** The mail's plain-text body. */
  readonly text = input.required<string>();

  protected readonly parts = computed(() => linkify(this.text()));
}
