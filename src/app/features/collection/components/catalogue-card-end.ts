import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/** The end of a catalogue card (a character or a descriptor on a phone): its caution, then "Edit" for admins. */
@Component({
  selector: 'hl-catalogue-card-end',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  styleUrl: './collection-lists.scss',
  host: { style: 'display: contents' },
  // A card's paragraphs are spaced by the card (.card p in the lists' sheet), which cannot reach in here.
  styles: `
    p.caution {
      margin: 0 0 4px;
    }
  `,
  template: `
    @if (caution(); as text) {
      <p class="caution"><mat-icon aria-hidden="true">warning</mat-icon><span><strong>Caution:</strong> {{ text }}</span></p>
    }
    @if (canEdit()) {
      <div class="card-actions">
        <button mat-button type="button" (click)="edit.emit()" [attr.aria-label]="'Edit ' + label()"><mat-icon>edit</mat-icon> Edit</button>
      </div>
    }
  `,
})
export class CatalogueCardEnd {
  /** What handling or reading it needs care with, if anything. */
  readonly caution = input<string | null>(null);
  /** The entry's name, for the edit button's accessible name. */
  readonly label = input.required<string>();
  /** Whether the person may edit the catalogue (admins). */
  readonly canEdit = input(false);
  readonly edit = output<void>();
}
