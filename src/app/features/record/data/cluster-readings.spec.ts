import type { Region } from '../../../../../shared/photo/region.js';
import { batchRefusal, clusterBatch, repeatedCharacter } from './cluster-readings';

const REGION: Region = { shape: 'rect', x: 0, y: 20, width: 400, height: 160 };

describe('saving the colours of a region as readings', () => {
  it('should make one photo reading per colour given a character, each naming its colour, and skip the rest', () => {
    const { body, clusterOf } = clusterBatch({ accessionId: 3, plantId: 7, light: 'overcast', characterIds: [11, null, 12] }, { photoId: 5, region: REGION, card: null });
    expect(clusterOf).toEqual([0, 2]);
    expect(body.readings.map((r) => [r.characterId, r.photo?.cluster])).toEqual([[11, 0], [12, 2]]);
    expect(body.readings[0]).toEqual({ accessionId: 3, plantId: 7, characterId: 11, method: 'photo', photo: { photoId: 5, region: REGION, cluster: 0 }, light: 'overcast' });
  });

  it('should send the grey card with every reading and leave out a plant not chosen', () => {
    const card: Region = { shape: 'point', x: 9, y: 9, radius: 4 };
    const { body } = clusterBatch({ accessionId: 3, plantId: null, light: 'open-shade', characterIds: [11, 12] }, { photoId: 5, region: REGION, card });
    expect(body.readings.every((r) => r.photo?.neutral?.region === card && !('plantId' in r))).toBe(true);
  });

  it('should find a character given to two colours', () => {
    expect(repeatedCharacter([11, 12])).toBe(-1);
    expect(repeatedCharacter([11, null, 11])).toBe(2);
    expect(repeatedCharacter([null, null])).toBe(-1);
  });

  it("should put each refusal on the colour its reading took, and the shared fields' once", () => {
    const r = batchRefusal(
      [
        { field: 'readings.1.photo.cluster', message: 'names colour 2, but the region holds 2 colours' },
        { field: 'readings.1.characterId', message: 'character 9 does not exist' },
        { field: 'readings.0.light', message: 'must be one of …' },
        { field: 'readings.1.light', message: 'must be one of …' },
        { field: 'readings', message: 'must hold at least one reading' },
      ],
      [0, 2],
    );
    expect(r.byCluster.get(2)).toEqual(['photo.cluster names colour 2, but the region holds 2 colours', 'Character: character 9 does not exist']);
    expect(r.byCluster.has(0)).toBe(false);
    expect(r.shared).toEqual({ light: 'must be one of …' });
    expect(r.other).toEqual(['readings must hold at least one reading']);
  });
});
