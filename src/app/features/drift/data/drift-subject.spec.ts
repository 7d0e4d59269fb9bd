import { choiceFromParams, paramsFromChoice, subjectOf } from './drift-subject';

describe('drift subject in the URL', () => {
  it('should read the ids and drop malformed ones', () => {
    expect(choiceFromParams({ accessionId: '3', characterId: 'x', siteId: '0' })).toEqual({ accessionId: 3, characterId: null, siteId: null });
  });

  it('should write every key so a cleared choice leaves the URL', () => {
    expect(paramsFromChoice({ accessionId: 3, characterId: 4, siteId: null })).toEqual({ accessionId: 3, characterId: 4, siteId: null });
  });

  it('should need both accession and character before analysing', () => {
    expect(subjectOf({ accessionId: 3, characterId: null, siteId: 1 })).toBeNull();
    expect(subjectOf({ accessionId: 3, characterId: 4, siteId: null })).toEqual({ accessionId: 3, characterId: 4, siteId: null });
  });
});
