import { applyMethodRules, buildReadingForm, isCutCharacter, nextPlantValue, photoProblem, readingRequest } from './reading-draft';
import { isRegion, photoSourceFromParams, photoSourceParams } from './photo-source';

const AT = new Date('2026-03-14T09:30:00.000Z');

function filled() {
  const form = buildReadingForm();
  form.patchValue({ accessionId: 1, plantId: 11, characterId: 5, siteId: 2, light: 'open-shade' });
  return form;
}

describe('reading draft', () => {
  it('should need L*a*b* only for an instrument reading, and refuse values out of range', () => {
    const form = filled();
    form.controls.method.setValue('instrument');
    applyMethodRules(form, 'instrument', false);
    expect(form.valid).toBe(false);
    form.controls.lab.setValue({ l: 42.1, a: 31.5, b: -12.2 });
    // An instrument reading needs the illuminant/observer it reports, and no light.
    expect(form.controls.illuminant.hasError('required')).toBe(true);
    form.controls.light.setValue(null);
    form.controls.illuminant.setValue('D65/10');
    expect(form.valid).toBe(true);
    form.controls.lab.controls.l.setValue(101);
    expect(form.controls.lab.controls.l.hasError('max')).toBe(true);
    form.controls.method.setValue('chip');
    applyMethodRules(form, 'chip', false);
    form.controls.lab.setValue({ l: null, a: null, b: null });
    expect(form.controls.lab.valid).toBe(true);
    expect(form.controls.chipCode.hasError('required')).toBe(true);
    expect(form.controls.light.hasError('required')).toBe(true);
    expect(form.controls.illuminant.valid).toBe(true);
  });

  it('should need a reason only for a correction', () => {
    const form = filled();
    form.patchValue({ method: 'chip', chipCode: 'F-087' });
    applyMethodRules(form, 'chip', true);
    expect(form.controls.reason.hasError('required')).toBe(true);
    applyMethodRules(form, 'chip', false);
    expect(form.valid).toBe(true);
  });

  it('should send only the chosen method’s parts', () => {
    const form = filled();
    form.patchValue({ method: 'instrument', lab: { l: 40, a: 20, b: -5 }, chipCode: 'F-001', hex: '#123456', eyeChipCode: 'F-087.014', notes: '  ', leafPosition: '3rd open leaf', instrument: ' Meter 2 ', illuminant: 'D65/10' });
    // The light left in the form from another method is not sent: the instrument lights the sample itself.
    expect(readingRequest(form.getRawValue(), null, false, AT)).toEqual({
      accessionId: 1,
      plantId: 11,
      characterId: 5,
      siteId: 2,
      method: 'instrument',
      illuminant: 'D65/10',
      observedAt: '2026-03-14T09:30:00.000Z',
      lab: [40, 20, -5],
      instrument: 'Meter 2',
      eyeChipCode: 'F-087.014',
      leafPosition: '3rd open leaf',
    });
  });

  it('should send a photo reading’s region and card, and seconds since cut only for cut tissue', () => {
    const form = filled();
    form.patchValue({ method: 'photo', secondsSinceCut: 45 });
    const region = { shape: 'rect' as const, x: 1, y: 2, width: 30, height: 40 };
    const card = { shape: 'point' as const, x: 5, y: 5, radius: 3 };
    const body = readingRequest(form.getRawValue(), { photoId: 7, region, neutral: card }, true, AT);
    expect(body.photo).toEqual({ photoId: 7, region, neutral: { region: card } });
    expect(body.secondsSinceCut).toBe(45);
    expect(readingRequest(form.getRawValue(), { photoId: 7, region, neutral: null }, false, AT).secondsSinceCut).toBeUndefined();
  });

  it('should say a photo reading lacks its photo', () => {
    expect(photoProblem('photo', null)).toContain('photo');
    expect(photoProblem('chip', null)).toBeNull();
  });

  it('should ask seconds since cut for corm, cormel and sap only', () => {
    const base = { id: 1, code: 'x', label: 'x', howToRead: '', caution: null, colour: true, active: true, driftThreshold: 1.8, sortOrder: 10 };
    expect(isCutCharacter({ ...base, organ: 'corm' })).toBe(true);
    expect(isCutCharacter({ ...base, organ: 'sap' })).toBe(true);
    expect(isCutCharacter({ ...base, organ: 'petiole' })).toBe(false);
    expect(isCutCharacter(null)).toBe(false);
  });

  it('should keep accession, character, light and site for the next plant and clear the rest', () => {
    const form = filled();
    form.patchValue({ method: 'chip', chipCode: 'F-087', notes: 'rain', secondsSinceCut: 30 });
    const next = nextPlantValue(form.getRawValue());
    expect(next).toMatchObject({ accessionId: 1, characterId: 5, light: 'open-shade', siteId: 2, method: 'chip', plantId: null, chipCode: null, notes: null, secondsSinceCut: null });
  });

  it('should carry a photo region through the address and refuse a malformed one', () => {
    const source = { photoId: 12, region: { shape: 'ellipse' as const, cx: 10, cy: 10, rx: 4, ry: 3 }, neutral: null };
    const params = photoSourceParams(source);
    expect(photoSourceFromParams(params)).toEqual(source);
    expect(photoSourceFromParams({ ...params, region: '{"shape":"rect","x":1}' })).toBeNull();
    expect(photoSourceFromParams({ ...params, photo: 'abc' })).toBeNull();
    expect(isRegion({ shape: 'polygon', points: [[0, 0], [1, 0]] })).toBe(false);
  });
});
