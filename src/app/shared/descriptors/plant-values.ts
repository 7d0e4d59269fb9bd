import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';

import type { DescriptorValue, PlantDescriptors } from '../../../../shared/api/descriptor-answers.js';
import { Viewport } from '../../core/layout/viewport';
import { UnitPreference } from '../../core/units/unit-preference';
import { LoadState } from '../load-state';
import { DescriptorsApi } from './descriptors-api';
import { shownValue, valueTable } from './value-table';
import { LocalDateTimePipe } from '../../core/format/local-date-time';

/**
 * The latest descriptor values of an accession's plants, in the person's units; derived ratios
 * are marked as computed. A table of plants side by side on a desk, a list per plant on a phone. With `plantId` set, only that plant (null: the whole accession).
 */
@Component({
  selector: 'hl-plant-values',
  imports: [LocalDateTimePipe, LoadState, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <hl-load-state [resource]="values" what="descriptor values">
      @if (asTable()) {
        <div class="hl-table-scroll">
          <table class="table">
            <thead>
              <tr>
                <th scope="col">Descriptor</th>
                @for (plant of plants(); track plant.plantId) {
                  <th scope="col" class="number">{{ plant.plantLabel ? 'Plant ' + plant.plantLabel : 'No plant' }}</th>
                }
              </tr>
            </thead>
            <tbody>
              @for (row of rows(); track row.descriptorId) {
                <tr>
                  <th scope="row">
                    {{ row.label }}
                    @if (row.derived) {
                      <span class="hl-muted derived"><mat-icon aria-hidden="true">calculate</mat-icon> computed</span>
                    }
                  </th>
                  @for (cell of row.cells; track $index) {
                    <td class="number">{{ cell ?? '—' }}</td>
                  }
                </tr>
              }
            </tbody>
          </table>
        </div>
      } @else {
      @for (plant of plants(); track plant.plantId) {
        <div class="plant">
          @if (showPlantNames()) {
            <h3>{{ plant.plantLabel ? 'Plant ' + plant.plantLabel : 'No particular plant' }}</h3>
          }
          <dl class="values">
            @for (value of plant.values; track value.descriptorId) {
              <dt>{{ value.label }}</dt>
              <dd>
                <span class="value">{{ shown(value) }}</span>
                @if (value.derived) {
                  <span class="hl-muted derived"><mat-icon aria-hidden="true">calculate</mat-icon> computed</span>
                } @else {
                  <span class="hl-muted when">{{ value.observedAt | localDateTime: 'date' }}</span>
                }
              </dd>
            }
          </dl>
        </div>
      } @empty {
        <p class="hl-empty"><mat-icon aria-hidden="true">straighten</mat-icon> No descriptor values recorded yet.</p>
      }
      }
    </hl-load-state>
  `,
  styles: `
    .table {
      border-collapse: collapse;
      width: 100%;
    }
    .table th,
    .table td {
      padding: 8px 12px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      text-align: start;
      font-weight: normal;
    }
    .table thead th {
      font-weight: 600;
    }
    .table .number {
      text-align: end;
      font-variant-numeric: tabular-nums;
    }
    .table td {
      font-weight: 600;
    }
    .plant h3 {
      font: var(--mat-sys-title-small);
      margin: 12px 0 4px;
    }
    .values {
      display: grid;
      grid-template-columns: minmax(0, 3fr) minmax(0, 2fr);
      align-items: baseline;
      gap: 4px 16px;
      margin: 0 0 8px;
    }
    dt {
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 0;
    }
    .when {
      display: block;
      font: var(--mat-sys-body-small);
    }
    .value {
      font-weight: 600;
      font-variant-numeric: tabular-nums;
    }
    .derived {
      display: inline-flex;
      align-items: center;
      gap: 2px;
      margin-left: 6px;
    }
    .derived mat-icon {
      font-size: 16px;
      width: 16px;
      height: 16px;
    }
  `,
})
export class PlantValues {
  private readonly api = inject(DescriptorsApi);
  private readonly units = inject(UnitPreference);
  private readonly handset = inject(Viewport).handset;

  /** The accession whose values are shown. */
  readonly accessionId = input.required<number>();
  /** One plant only (its id), or every plant when undefined; null means values of no particular plant. */
  readonly plantId = input<number | null | undefined>(undefined);
  /** Changes whenever the values should be fetched again (e.g. a count of saves). */
  readonly reload = input(0);

  protected readonly values = rxResource({
    params: () => ({ id: this.accessionId(), reload: this.reload() }),
    stream: ({ params }) => this.api.accessionValues(params.id),
  });
  protected readonly plants = computed<PlantDescriptors[]>(() => {
    const plants = (this.values.value()?.plants ?? []).filter((plant) => plant.values.length > 0);
    const only = this.plantId();
    return only === undefined ? plants : plants.filter((plant) => plant.plantId === only);
  });
  protected readonly showPlantNames = computed(() => this.plantId() === undefined);
  /** On a desk with several plants, one table side by side; on a phone, or for one plant, a list. */
  protected readonly asTable = computed(() => !this.handset() && this.plants().length > 1);
  protected readonly rows = computed(() => valueTable(this.plants(), this.units.system()));

  protected shown(value: DescriptorValue): string {
    return shownValue(value, this.units.system());
  }
}
