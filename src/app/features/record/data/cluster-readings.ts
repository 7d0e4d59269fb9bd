// Saving the colours of a region that is not even as readings of their own characters (the
// ground of a striped petiole as one character, the stripes as another) in one request. Kept
// apart from the component so the body and the refusals can be tested without a browser.
import type { FieldError } from '../../../../../shared/api/problem.js';
import type { CreateReadingRequest, Light } from '../../../../../shared/api/reading-answers.js';
import type { Region } from '../../../../../shared/photo/region.js';

/** What the recorder chose: the plant, the light, and a character (or none) for each colour, largest share first. */
export interface ClusterChoices {
  accessionId: number;
  plantId: number | null;
  light: Light;
  /** Per colour of the region, in the sample's order; null leaves that colour unsaved. */
  characterIds: readonly (number | null)[];
}

/** Where the colours were measured: the stored photo, its region, the grey card if one was marked. */
export interface ClusterPhoto {
  photoId: number;
  region: Region;
  card: Region | null;
}

/** The batch body and, for each reading in it, the colour it takes (index into the sample's clusters). */
export interface ClusterBatch {
  body: { readings: CreateReadingRequest[] };
  clusterOf: number[];
}

/** One photo reading per colour given a character, in colour order; an empty list when none is. */
export function clusterBatch(choices: ClusterChoices, photo: ClusterPhoto): ClusterBatch {
  const readings: CreateReadingRequest[] = [];
  const clusterOf: number[] = [];
  choices.characterIds.forEach((characterId, cluster) => {
    if (characterId === null) return;
    clusterOf.push(cluster);
    readings.push({
      accessionId: choices.accessionId,
      ...(choices.plantId !== null ? { plantId: choices.plantId } : {}),
      characterId,
      method: 'photo',
      photo: { photoId: photo.photoId, region: photo.region, ...(photo.card ? { neutral: { region: photo.card } } : {}), cluster },
      light: choices.light,
    });
  });
  return { body: { readings }, clusterOf };
}

/** The index of the first colour given the same character as an earlier one, or -1 (the server refuses the pair too). */
export function repeatedCharacter(characterIds: readonly (number | null)[]): number {
  return characterIds.findIndex((id, i) => id !== null && characterIds.indexOf(id) < i);
}

/** A batch refusal sorted for the screen: per colour, per shared field (accession, plant, light), and the rest. */
export interface BatchRefusal {
  /** Messages by colour index. */
  byCluster: Map<number, string[]>;
  /** Messages for the fields every reading shares, by field name. */
  shared: Partial<Record<'accessionId' | 'plantId' | 'light', string>>;
  other: string[];
}

const SHARED_FIELDS = ['accessionId', 'plantId', 'light'] as const;

/**
 * Reads `readings.<i>.<field>` refusals back onto the colour the i-th reading took; the shared
 * fields go to their own controls, once. Anything else is shown as it came.
 */
export function batchRefusal(errors: readonly FieldError[], clusterOf: readonly number[]): BatchRefusal {
  const out: BatchRefusal = { byCluster: new Map(), shared: {}, other: [] };
  for (const { field, message } of errors) {
    const m = /^readings\.(\d+)\.(.+)$/.exec(field);
    const cluster = m ? clusterOf[Number(m[1])] : undefined;
    if (!m || cluster === undefined) {
      out.other.push(`${field} ${message}`);
      continue;
    }
    const rest = m[2]!;
    const shared = SHARED_FIELDS.find((f) => f === rest);
    if (shared) out.shared[shared] ??= message;
    else out.byCluster.set(cluster, [...(out.byCluster.get(cluster) ?? []), rest === 'characterId' ? `Character: ${message}` : `${rest} ${message}`]);
  }
  return out;
}
