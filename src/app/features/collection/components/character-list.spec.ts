import { ComponentFixture, TestBed } from '@angular/core/testing';

import type { Character } from '../../../../../shared/api/collection-answers.js';
import { TEST_CHARACTERS } from '../../../shared/testing/collection-fixtures';
import { CharacterList } from './character-list';

describe('CharacterList on a desk', () => {
  let fixture: ComponentFixture<CharacterList>;
  let element: HTMLElement;
  let edited: Character[];

  async function show(canEdit: boolean): Promise<void> {
    fixture = TestBed.createComponent(CharacterList);
    fixture.componentRef.setInput('characters', TEST_CHARACTERS);
    fixture.componentRef.setInput('canEdit', canEdit);
    edited = [];
    fixture.componentInstance.edit.subscribe((character) => edited.push(character));
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  const headers = () => Array.from(element.querySelectorAll('th')).map((th) => th.textContent?.trim());

  it('should give admins an edit button per row, named after the character, that asks to edit that character', async () => {
    await show(true);
    expect(headers()).toEqual(['Organ', 'Character', 'How to read it', 'Caution', 'Drift above ΔE00', 'Actions']);
    element.querySelector<HTMLButtonElement>('button[aria-label="Edit Corm flesh, centre"]')!.click();
    expect(edited.map((c) => c.id)).toEqual([7]);
  });

  it('should leave the edit column out for everyone else', async () => {
    await show(false);
    expect(headers()).toEqual(['Organ', 'Character', 'How to read it', 'Caution', 'Drift above ΔE00']);
    expect(element.querySelector('button[aria-label^="Edit"]')).toBeNull();
  });
});
