import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';

import { ORGANS, type Character } from '../../../../../shared/api/collection-answers.js';
import { CatalogueCardEnd } from './catalogue-card-end';
import { CatalogueEditColumn } from './catalogue-edit-column';
import { CatalogueList } from './catalogue-list';

/** The character catalogue: what to read and how, with cautions marked by icon and word; admins get an edit button per row. */
@Component({
  selector: 'hl-character-list',
  imports: [CatalogueCardEnd, CatalogueEditColumn, MatIconModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './character-list.html',
  styleUrl: './collection-lists.scss',
})
export class CharacterList extends CatalogueList<Character> {
  /** The characters to show. */
  readonly characters = input.required<readonly Character[]>();

  protected readonly columns = ['organ', 'label', 'howToRead', 'caution', 'drift'];
  /** The catalogue by organ, in the order of the plant from leaf to flower, then by label. */
  protected readonly byOrgan = computed(() =>
    [...this.characters()].sort((a, b) => ORGANS.indexOf(a.organ) - ORGANS.indexOf(b.organ) || a.label.localeCompare(b.label)),
  );
  /** Whether a row starts a new organ (its organ is shown; following rows of the same organ leave it blank). */
  protected firstOfOrgan(index: number): boolean {
    const rows = this.byOrgan();
    return index === 0 || rows[index - 1].organ !== rows[index].organ;
  }
}
