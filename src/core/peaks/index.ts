export type { CrossPeak, CrossPeakExtent, Extremum, LevelOptions, Line1D, Multiplet1D } from './types';
export { pickExtrema2D } from './extrema2D';
export { linkExtrema, type LinkOptions } from './group2D';
export { pickCrossPeaks, type CrossPeakOptions } from './crossPeaks';
export { nearestCrossPeak } from './nearest';
export { pickMultiplets1D, type Multiplet1DOptions } from './multiplets1D';
export { isDiagonal, assignPartners } from './symmetry';
export { parabolicOffset, parabolicHeight, lorentzianPeak } from './interpolate';
export { pickingLevel, type PickingLevel } from './level';
