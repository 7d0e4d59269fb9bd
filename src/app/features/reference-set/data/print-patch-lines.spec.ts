import { parsePatchLines, patchRefusals } from './print-patch-lines';

describe('measured patch lines', () => {
  it('should read a code and three numbers per line, whatever separates them, skipping blank lines', () => {
    const { patches, problems } = parsePatchLines('F-190 52.1 -10.3 20.4\n\nf-191.004\t60,5\t−2\t3\nF-192;40;1.5;-7\nF-193,41,2,3');
    expect(problems).toEqual([]);
    expect(patches).toEqual([
      { line: 1, chipCode: 'F-190', lab: [52.1, -10.3, 20.4] },
      { line: 3, chipCode: 'F-191.004', lab: [60.5, -2, 3] },
      { line: 4, chipCode: 'F-192', lab: [40, 1.5, -7] },
      { line: 5, chipCode: 'F-193', lab: [41, 2, 3] },
    ]);
  });

  it('should name each line it cannot read', () => {
    const { patches, problems } = parsePatchLines('F-190 52 1\nchip 50 0 0\nF-191 50 0 0');
    expect(patches.map((p) => p.line)).toEqual([3]);
    expect(problems).toEqual([
      'Line 1: give a chip code (like F-190 or F-190.004) and three numbers, L* a* b*.',
      'Line 2: give a chip code (like F-190 or F-190.004) and three numbers, L* a* b*.',
    ]);
  });

  it("should put the server's refusals back on the lines they came from", () => {
    const { patches } = parsePatchLines('F-190 50 0 0\n\nF-999 50 0 0\nF-191 120 0 0');
    const messages = patchRefusals(
      [
        { field: 'patches.1.chipCode', message: 'F-999 is not a chip of set v2' },
        { field: 'patches.2.lab.0', message: 'L* must be from 0 to 100' },
        { field: 'patches', message: 'must hold at least one patch' },
      ],
      patches,
    );
    expect(messages).toEqual(['Line 3 (chip code): F-999 is not a chip of set v2', 'Line 4 (CIELAB): L* must be from 0 to 100', 'patches must hold at least one patch']);
  });
});
