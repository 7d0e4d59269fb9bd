import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';

import type { Descriptor } from '../../../../../shared/api/descriptor-answers.js';
import { CatalogueCardEnd } from './catalogue-card-end';
import { CatalogueEditColumn } from './catalogue-edit-column';
import { CatalogueList } from './catalogue-list';
import { KIND_WORDS, ratioParts } from '../data/descriptor-words';

/** The descriptor catalogue: kind, units, categories and ratio parts; admins get an edit button per row. */
@Component({
  selector: 'hl-descriptor-list',
  imports: [CatalogueCardEnd, CatalogueEditColumn, MatIconModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './descriptor-list.html',
  styleUrl: './collection-lists.scss',
})
export class DescriptorList extends CatalogueList<Descriptor> {
  /** The catalogue. */
  readonly descriptors = input.required<readonly Descriptor[]>();

  protected readonly columns = ['label', 'kind', 'values', 'howToMeasure'];

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
