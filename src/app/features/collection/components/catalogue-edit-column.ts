import { ChangeDetectionStrategy, Component, OnDestroy, OnInit, ViewChild, inject, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatCellDef, MatColumnDef, MatHeaderCellDef, MatTable, MatTableModule } from '@angular/material/table';

/**
 * The `actions` column of a catalogue table (characters, descriptors): an edit button per row,
 * named after the row's label. Put it inside the `mat-table`; it adds its column to the table
 * the way Material's own text column does. The table's phone cards end with CatalogueCardEnd.
 */
@Component({
  selector: 'hl-catalogue-edit-column',
  imports: [MatButtonModule, MatIconModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  // Only what its own cells need (the lists' cell padding and the button's place): the cells come
  // from this template, so the lists' stylesheet does not reach them.
  styles: `
    td {
      vertical-align: top;
      padding-top: 12px;
      padding-bottom: 12px;
    }
    .actions-cell {
      white-space: nowrap;
      text-align: end;
    }
  `,
  template: `
    <ng-container matColumnDef="actions">
      <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Actions</span></th>
      <td mat-cell *matCellDef="let row" class="actions-cell">
        <button mat-icon-button type="button" (click)="edit.emit(row)" [attr.aria-label]="'Edit ' + row.label"><mat-icon>edit</mat-icon></button>
      </td>
    </ng-container>
  `,
})
export class CatalogueEditColumn<T extends { label: string }> implements OnInit, OnDestroy {
  private readonly table = inject<MatTable<T>>(MatTable);
  // Static, so that the column is whole when the table first draws its rows: the column's own
  // content queries would only find its cells later, so they are handed over in ngOnInit.
  @ViewChild(MatColumnDef, { static: true }) private readonly columnDef!: MatColumnDef;
  @ViewChild(MatHeaderCellDef, { static: true }) private readonly headerCell!: MatHeaderCellDef;
  @ViewChild(MatCellDef, { static: true }) private readonly cell!: MatCellDef;

  /** Asks to edit a row. */
  readonly edit = output<T>();

  ngOnInit(): void {
    this.columnDef.headerCell = this.headerCell;
    this.columnDef.cell = this.cell;
    this.table.addColumnDef(this.columnDef);
  }

  ngOnDestroy(): void {
    this.table.removeColumnDef(this.columnDef);
  }
}
