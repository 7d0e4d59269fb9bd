import { ChangeDetectionStrategy, Component } from '@angular/core';

/**
 * One tab of the collection page: its actions (elements marked `tabAction`: a download, an admin's
 * "Add"), right-aligned above its list; the row is left out when there is no action to show.
 */
@Component({
  selector: 'hl-collection-tab',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="tab-actions"><ng-content select="[tabAction]" /></div>
    <ng-content />
  `,
  styles: `
    :host {
      display: block;
      padding: 16px 0;
    }
    .tab-actions {
      display: flex;
      flex-wrap: wrap;
      justify-content: flex-end;
      gap: 8px;
      margin-bottom: 12px;
    }
    /* An action hidden by @if leaves only a comment, which :empty passes over. */
    .tab-actions:empty {
      display: none;
    }
  `,
})
export class CollectionTab {}
