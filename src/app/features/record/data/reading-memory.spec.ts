import { TestBed } from '@angular/core/testing';

import { READING_DRAFT_KEY, READING_MEMORY_KEY, ReadingDraftStore, ReadingMemory } from './reading-memory';

describe('ReadingMemory', () => {
  beforeEach(() => {
    localStorage.clear();
    sessionStorage.clear();
  });

  it('should remember the last accession, character and light across visits', () => {
    TestBed.inject(ReadingMemory).remember({ accessionId: 4, characterId: 9, light: 'overcast' });
    expect(JSON.parse(localStorage.getItem(READING_MEMORY_KEY)!)).toEqual({ accessionId: 4, characterId: 9, light: 'overcast' });
    expect(TestBed.inject(ReadingMemory).recall()).toEqual({ accessionId: 4, characterId: 9, light: 'overcast', method: null, instrument: null, illuminant: null });
  });

  it('should read nothing from an empty, broken or hand-edited store', () => {
    const memory = TestBed.inject(ReadingMemory);
    expect(memory.recall()).toEqual({ accessionId: null, characterId: null, light: null, method: null, instrument: null, illuminant: null });
    localStorage.setItem(READING_MEMORY_KEY, '{not json');
    expect(memory.recall()).toEqual({ accessionId: null, characterId: null, light: null, method: null, instrument: null, illuminant: null });
    localStorage.setItem(READING_MEMORY_KEY, JSON.stringify({ accessionId: -3, characterId: '9', light: 7 }));
    expect(memory.recall()).toEqual({ accessionId: null, characterId: null, light: null, method: null, instrument: null, illuminant: null });
  });

  it('should keep a draft for this tab until it is dropped', () => {
    const drafts = TestBed.inject(ReadingDraftStore);
    drafts.keep({ notes: 'row 4' });
    expect(drafts.read()).toEqual({ notes: 'row 4' });
    drafts.drop();
    expect(sessionStorage.getItem(READING_DRAFT_KEY)).toBeNull();
    expect(drafts.read()).toBeNull();
  });
});
