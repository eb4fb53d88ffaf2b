// Pure statistics: no I/O, no clock, nothing imported from elsewhere in src/.
// Missing values (null, undefined, NaN, ±Infinity) are skipped the same way everywhere: see finiteValues.
export { agreement, logAgreement, type AgreementResult, type LogAgreementResult } from './agreement.ts';
export { anomaly, type Anomaly } from './anomaly.ts';
export { benjaminiHochberg, type FalseDiscoveryResult } from './benjaminiHochberg.ts';
export { climatology, type BaselinePeriod, type ClimatologyEntry } from './climatology.ts';
export { finiteOrNull, finitePairs, finiteValues } from './finiteValues.ts';
export { hamedRao, type HamedRaoResult } from './hamedRao.ts';
export { mannKendall, type MannKendallResult, type TrendReason } from './mannKendall.ts';
export { mean } from './mean.ts';
export { median } from './median.ts';
export { normalQuantile } from './normalQuantile.ts';
export { normalSurvival } from './normalSurvival.ts';
export { percentileRank } from './percentileRank.ts';
export { ar1Pettitt, pettitt, type Ar1PettittResult, type PettittResult } from './pettitt.ts';
export { quantile, quantileSorted } from './quantile.ts';
export { sampleStandardDeviation } from './sampleStandardDeviation.ts';
export { seasonalKendall, type SeasonalKendallResult, type SeasonResult } from './seasonalKendall.ts';
export { selectKth } from './selectKth.ts';
export { sensSlope, type SensSlopeResult } from './sensSlope.ts';
export { trophicClass, TROPHIC_BOUNDS, type TrophicClass } from './trophicClass.ts';
export { carlsonClass, trophicStateIndex, type CarlsonClass } from './trophicStateIndex.ts';
export { chiSquareSurvival } from './chiSquareSurvival.ts';
export { kruskalWallis, type KruskalWallisResult } from './kruskalWallis.ts';
export { weightedMedian } from './weightedMedian.ts';
export { ar1MannKendall, calendarMonthAnomalies, type Ar1MannKendallResult } from './ar1MannKendall.ts';
export { studentTTwoSided } from './studentT.ts';
