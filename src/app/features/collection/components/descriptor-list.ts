import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';

import type { Descriptor } from '../../../../../shared/api/descriptor-answers.js';
import { Viewport } from '../../../core/layout/viewport';
import { CatalogueCardEnd } from './catalogue-card-end';
import { KIND_WORDS, ratioParts } from '../data/descriptor-words';

/** The descriptor catalogue: kind, units, categories and ratio parts; admins get an edit button per row. */
@Component({
  selector: 'hl-descriptor-list',
  imports: [CatalogueCardEnd, MatButtonModule, MatIconModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './descriptor-list.html',
  styleUrl: './collection-lists.scss',
})
export class DescriptorList {
  /** The catalogue. */
  readonly descriptors = input.required<readonly Descriptor[]>();
  /** Whether the person may edit descriptors (admins). */
  readonly canEdit = input(false);
  /** Asks to edit a descriptor. */
  readonly edit = output<Descriptor>();

  protected readonly handset = inject(Viewport).handset;
  protected readonly shownColumns = computed(() => ['label', 'kind', 'values', 'howToMeasure', ...(this.canEdit() ? ['actions'] : [])]);

  protected words(descriptor: Descriptor): { kind: string; units: string } {
    return KIND_WORDS[descriptor.kind];
  }

  protected parts(descriptor: Descriptor): string | null {
    return ratioParts(descriptor, this.descriptors());
  }

  protected categories(descriptor: Descriptor): string {
    return descriptor.categories.map((c) => c.label).join('; ');
  }
}
