import { Directive, computed, inject, input, output } from '@angular/core';

import { Viewport } from '../../../core/layout/viewport';

/**
 * What the collection's catalogue lists (characters, descriptors) share: cards on a phone and a
 * table on a desk, and for admins an edit action per entry (CatalogueCardEnd on a card,
 * CatalogueEditColumn in the table).
 */
@Directive()
export abstract class CatalogueList<T> {
  /** Whether the person may edit the catalogue (admins). */
  readonly canEdit = input(false);
  /** Asks to edit an entry. */
  readonly edit = output<T>();

  protected readonly handset = inject(Viewport).handset;
  /** The table's own columns, before the edit column. */
  protected abstract readonly columns: readonly string[];
  /** The columns shown: the edit column is added for admins only. */
  protected readonly shownColumns = computed(() => (this.canEdit() ? [...this.columns, 'actions'] : this.columns));
}
