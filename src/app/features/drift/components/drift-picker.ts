import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';

import type { Accession, Character, Site } from '../../../../../shared/api/collection-answers.js';
import type { DriftChoice } from '../data/drift-subject';

/** Accession, colour character and (optionally) site for the drift pages; each change goes up into the URL. */
@Component({
  selector: 'hl-drift-picker',
  imports: [MatFormFieldModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let c = choice();
    <div class="grid">
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Accession</mat-label>
        <mat-select [value]="c.accessionId" (selectionChange)="set({ accessionId: $event.value })">
          @for (a of accessions(); track a.id) {
            <mat-option [value]="a.id">{{ a.accessionNumber }} · {{ a.name }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Character</mat-label>
        <mat-select [value]="c.characterId" (selectionChange)="set({ characterId: $event.value })">
          @for (ch of colourCharacters(); track ch.id) {
            <mat-option [value]="ch.id">{{ ch.label }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      @if (showSite()) {
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Site</mat-label>
          <mat-select [value]="c.siteId" (selectionChange)="set({ siteId: $event.value })">
            <mat-option [value]="null">Every site</mat-option>
            @for (s of sites(); track s.id) {
              <mat-option [value]="s.id">{{ s.code }} · {{ s.name }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
      }
    </div>
  `,
  styles: `
    .grid {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(240px, 1fr));
      gap: 8px 12px;
    }
  `,
})
export class DriftPicker {
  readonly choice = input.required<DriftChoice>();
  readonly accessions = input.required<readonly Accession[]>();
  readonly characters = input.required<readonly Character[]>();
  readonly sites = input<readonly Site[]>([]);
  /** Whether to offer the site (the drift page does; the site comparison covers every site). */
  readonly showSite = input(true);
  readonly changed = output<Partial<DriftChoice>>();

  protected readonly colourCharacters = computed(() => this.characters().filter((c) => c.colour));

  protected set(change: Partial<DriftChoice>): void {
    this.changed.emit(change);
  }
}
