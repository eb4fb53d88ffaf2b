// Pure statistics: no I/O, no clock, nothing imported from elsewhere in src/.
export { finiteValues } from './finiteValues.ts';
export { median } from './median.ts';
export { quantile, quantileSorted } from './quantile.ts';
