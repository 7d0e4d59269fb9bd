import type { DataSource } from 'typeorm';
import { KIND_QUANTITY, type DescriptorValue, type FormattedValue } from '../../shared/api/descriptor-answers.js';
import type { DescriptorSummary } from '../../shared/api/profile-answers.js';
import { formatRatio, formatSi } from '../../shared/units/units.js';
import { accessionDescriptors } from '../collection/descriptor-values.js';
import { Descriptor } from '../collection/descriptor.entity.js';
import { median } from './robust-centre.js';

function formatted(kind: DescriptorValue['kind'], value: number): FormattedValue {
  const quantity = KIND_QUANTITY[kind];
  if (!quantity) return { metric: formatRatio(value), imperial: formatRatio(value) };
  return { metric: formatSi(value, quantity, 'metric'), imperial: formatSi(value, quantity, 'imperial') };
}

/**
 * Each descriptor summarised over the latest value of each plant (ratios from the same plant's own
 * parts, as the accession page shows them): numbers as median and range, because a few plants
 * rarely give a distribution worth a mean and a standard deviation; categories as the commonest
 * one and its share. Catalogue order.
 */
export async function describeDescriptors(ds: DataSource, accessionId: number): Promise<DescriptorSummary[]> {
  const values = (await accessionDescriptors(ds, accessionId)).plants.flatMap((p) => p.values);
  const catalogue = await ds.getRepository(Descriptor).find({ order: { sortOrder: 'ASC', id: 'ASC' } });
  const out: DescriptorSummary[] = [];
  for (const d of catalogue) {
    const mine = values.filter((v) => v.descriptorId === d.id);
    if (!mine.length) continue;
    const base = { descriptorId: d.id, code: d.code, label: d.label, kind: d.kind, n: mine.length };
    if (d.kind === 'category') {
      const counts = new Map<string, number>();
      for (const v of mine) if (v.category !== null) counts.set(v.category, (counts.get(v.category) ?? 0) + 1);
      const order = d.categories.map((c) => c.id);
      const rank = (id: string) => (order.includes(id) ? order.indexOf(id) : order.length);
      const [mode, count] = [...counts.entries()].sort((a, b) => b[1] - a[1] || rank(a[0]) - rank(b[0]))[0] ?? [null, 0];
      out.push({ ...base, median: null, min: null, max: null, formatted: null, mode, modeLabel: d.categories.find((c) => c.id === mode)?.label ?? mode, share: mine.length ? count / mine.length : null });
      continue;
    }
    const xs = mine.map((v) => v.valueSi).filter((x): x is number => x !== null);
    if (!xs.length) continue;
    const med = median(xs);
    const min = Math.min(...xs);
    const max = Math.max(...xs);
    out.push({ ...base, median: med, min, max, formatted: { median: formatted(d.kind, med), min: formatted(d.kind, min), max: formatted(d.kind, max) }, mode: null, modeLabel: null, share: null });
  }
  return out;
}
