import { IDENTITY, MAX_ZOOM, clampPan, panBy, toPhoto, zoomAbout } from './view-transform';

describe('view transform', () => {
  it('should keep the point zoomed about under the finger', () => {
    const view = zoomAbout(IDENTITY, 2, 100, 50, 400, 300);
    expect(view.scale).toBe(2);
    // The photo point under (100, 50) before is still under it after.
    expect(toPhoto(view, 100, 50, 400, 4000)).toEqual(toPhoto(IDENTITY, 100, 50, 400, 4000));
  });

  it('should not zoom out past the whole photo or in past the closest zoom', () => {
    expect(zoomAbout(IDENTITY, 0.5, 0, 0, 400, 300)).toEqual(IDENTITY);
    expect(zoomAbout(IDENTITY, 1000, 0, 0, 400, 300).scale).toBe(MAX_ZOOM);
  });

  it('should keep the zoomed photo covering the frame when panned', () => {
    const zoomed = { scale: 2, tx: 0, ty: 0 };
    expect(panBy(zoomed, 50, 50, 400, 300)).toEqual({ scale: 2, tx: 0, ty: 0 });
    expect(panBy(zoomed, -1000, -1000, 400, 300)).toEqual({ scale: 2, tx: -400, ty: -300 });
    expect(clampPan({ scale: 1, tx: -20, ty: 5 }, 400, 300)).toEqual(IDENTITY);
  });

  it('should map screen points to photo pixels', () => {
    expect(toPhoto(IDENTITY, 200, 150, 400, 4000)).toEqual([2000, 1500]);
    expect(toPhoto({ scale: 2, tx: -400, ty: -300 }, 0, 0, 400, 4000)).toEqual([2000, 1500]);
  });
});
