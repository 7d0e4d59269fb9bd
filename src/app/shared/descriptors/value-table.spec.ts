import type { DescriptorValue, PlantDescriptors } from '../../../../shared/api/descriptor-answers.js';
import { valueTable } from './value-table';

function value(descriptorId: number, label: string, metric: string, imperial: string, derived = false): DescriptorValue {
  return {
    descriptorId,
    code: `d${descriptorId}`,
    label,
    kind: derived ? 'ratio' : 'length',
    valueSi: 1,
    category: null,
    categoryLabel: null,
    formatted: { metric, imperial },
    observedAt: '2026-03-14T09:30:00Z',
    observationId: derived ? null : descriptorId,
    derived,
    from: null,
  };
}

const plants: PlantDescriptors[] = [
  { plantId: 1, plantLabel: 'P1', values: [value(1, 'Petiole length', '101.6 cm', '40.0 in'), value(3, 'Ratio', '0.70', '0.70', true)] },
  { plantId: 2, plantLabel: 'P2', values: [value(2, 'Corm mass', '850 g', '1.87 lb'), value(1, 'Petiole length', '96.5 cm', '38.0 in')] },
];

describe('value table', () => {
  it('should put each descriptor on one row with a cell per plant, blank where a plant has none', () => {
    expect(valueTable(plants, 'metric')).toEqual([
      { descriptorId: 1, label: 'Petiole length', derived: false, cells: ['101.6 cm', '96.5 cm'] },
      { descriptorId: 3, label: 'Ratio', derived: true, cells: ['0.70', null] },
      { descriptorId: 2, label: 'Corm mass', derived: false, cells: [null, '850 g'] },
    ]);
  });

  it('should show the imperial text for an imperial person', () => {
    expect(valueTable(plants, 'imperial')[0].cells).toEqual(['40.0 in', '38.0 in']);
  });
});
