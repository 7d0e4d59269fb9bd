import { IsNull, type DataSource } from 'typeorm';
import type { AccessionDescriptors, DescriptorValue, FormattedValue, PlantDescriptors } from '../../shared/api/descriptor-answers.js';
import { KIND_QUANTITY } from '../../shared/api/descriptor-answers.js';
import { formatRatio, formatSi, tidy } from '../../shared/units/units.js';
import { findAccession } from './accessions.js';
import { Descriptor } from './descriptor.entity.js';
import { Observation } from './observation.entity.js';

function formatted(d: Descriptor, o: Observation): FormattedValue {
  if (d.kind === 'category') {
    const label = d.categories.find((c) => c.id === o.category)?.label ?? o.category ?? '';
    return { metric: label, imperial: label };
  }
  const quantity = KIND_QUANTITY[d.kind]!;
  return { metric: formatSi(o.valueSi!, quantity, 'metric'), imperial: formatSi(o.valueSi!, quantity, 'imperial') };
}

function observedValue(d: Descriptor, o: Observation): DescriptorValue {
  return {
    descriptorId: d.id,
    code: d.code,
    label: d.label,
    kind: d.kind,
    valueSi: o.valueSi,
    category: o.category,
    categoryLabel: d.kind === 'category' ? (d.categories.find((c) => c.id === o.category)?.label ?? null) : null,
    formatted: formatted(d, o),
    observedAt: o.observedAt.toISOString(),
    observationId: o.id,
    derived: false,
    from: null,
  };
}

/** A ratio from the latest numerator and denominator of one plant; null when either is missing or the denominator is 0. */
function derivedValue(ratio: Descriptor, latest: ReadonlyMap<string, Observation>): DescriptorValue | null {
  const top = latest.get(ratio.numeratorCode!);
  const bottom = latest.get(ratio.denominatorCode!);
  if (!top || !bottom || top.valueSi === null || bottom.valueSi === null || bottom.valueSi === 0) return null;
  const value = tidy(top.valueSi / bottom.valueSi);
  const at = top.observedAt > bottom.observedAt ? top.observedAt : bottom.observedAt;
  return {
    descriptorId: ratio.id,
    code: ratio.code,
    label: ratio.label,
    kind: 'ratio',
    valueSi: value,
    category: null,
    categoryLabel: null,
    formatted: { metric: formatRatio(value), imperial: formatRatio(value) },
    observedAt: at.toISOString(),
    observationId: null,
    derived: true,
    from: { numeratorId: top.id, denominatorId: bottom.id },
  };
}

/**
 * The latest current value of each descriptor for each plant of an accession (observations of
 * no particular plant form their own group), plus every ratio computed from the latest values of
 * the same plant, never across plants. Groups in plant-label order, values in catalogue order.
 */
export async function accessionDescriptors(ds: DataSource, accessionId: number): Promise<AccessionDescriptors> {
  const accession = await findAccession(ds.manager, accessionId);
  const descriptors = await ds.getRepository(Descriptor).find({ order: { sortOrder: 'ASC', id: 'ASC' } });
  const observations = await ds.getRepository(Observation).find({
    where: { accession: { id: accessionId }, supersededBy: IsNull() },
    relations: { descriptor: true },
    order: { observedAt: 'DESC', id: 'DESC' },
  });
  // Newest first, so the first seen per plant and descriptor is the latest.
  const groups = new Map<number | null, Map<string, Observation>>();
  for (const o of observations) {
    const key = o.plantId ?? null;
    const latest = groups.get(key) ?? new Map<string, Observation>();
    groups.set(key, latest);
    if (!latest.has(o.descriptor.code)) latest.set(o.descriptor.code, o);
  }
  const labelOf = new Map(accession.plants.map((p) => [p.id, p.label]));
  const plants: PlantDescriptors[] = [...groups.entries()].map(([plantId, latest]) => ({
    plantId,
    plantLabel: plantId === null ? null : (labelOf.get(plantId) ?? null),
    values: descriptors
      .map((d) => (d.kind === 'ratio' ? derivedValue(d, latest) : latest.has(d.code) ? observedValue(d, latest.get(d.code)!) : null))
      .filter((v): v is DescriptorValue => v !== null),
  }));
  plants.sort((a, b) => (a.plantLabel === null ? 1 : b.plantLabel === null ? -1 : a.plantLabel.localeCompare(b.plantLabel, 'en', { numeric: true })));
  return { accessionId, plants };
}
