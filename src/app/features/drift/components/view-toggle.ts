import { ChangeDetectionStrategy, Component, model } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';

/** Chart or table: every chart offers a table with the same numbers (accessibility, copying out). */
@Component({
  selector: 'hl-view-toggle',
  imports: [MatButtonToggleModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-button-toggle-group [value]="table() ? 'table' : 'chart'" (change)="table.set($event.value === 'table')" [attr.aria-label]="'Show as'" hideSingleSelectionIndicator>
      <mat-button-toggle value="chart"><mat-icon aria-hidden="true">scatter_plot</mat-icon> Chart</mat-button-toggle>
      <mat-button-toggle value="table"><mat-icon aria-hidden="true">table_rows</mat-icon> Table</mat-button-toggle>
    </mat-button-toggle-group>
  `,
  styles: `
    mat-button-toggle-group {
      --mat-button-toggle-height: 48px;
    }
    mat-icon {
      vertical-align: middle;
    }
  `,
})
export class ViewToggle {
  /** Whether the table is shown instead of the chart. */
  readonly table = model(false);
}
