import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';

import type { Character } from '../../../../../shared/api/collection.js';
import { Viewport } from '../../../core/layout/viewport';

/** The character catalogue: what to read and how, with cautions marked by icon and word. */
@Component({
  selector: 'hl-character-list',
  imports: [MatIconModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './character-list.html',
  styleUrl: './collection-lists.scss',
})
export class CharacterList {
  /** The characters to show. */
  readonly characters = input.required<readonly Character[]>();

  protected readonly handset = inject(Viewport).handset;
  protected readonly columns = ['organ', 'label', 'howToRead', 'caution'];
}
