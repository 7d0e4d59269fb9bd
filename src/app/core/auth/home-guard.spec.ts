import { HOME_PATHS, homePathFor } from './home-guard';

describe('home page by role', () => {
  it('should start recorders on Record, reviewers on Review, trainers on Calibration', () => {
    expect(homePathFor('recorder')).toBe('/record');
    expect(homePathFor('reviewer')).toBe('/review');
    expect(homePathFor('trainer')).toBe('/calibration');
  });

  it('should start admins and unknown roles on Collection', () => {
    expect(HOME_PATHS.admin).toBe('/collection');
    expect(homePathFor(null)).toBe('/collection');
  });
});
