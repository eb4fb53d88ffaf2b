import { finitePairs } from './finiteValues.ts';
import { median } from './median.ts';

export interface AgreementResult {
  n: number;
  /** Mean of estimate − reference. */
  bias: number;
  meanAbsoluteError: number;
  rootMeanSquareError: number;
  /** Coefficient of determination of the least-squares line: the squared Pearson correlation. */
  rSquared: number;
  /** Least-squares line estimate = intercept + slope · reference. */
  slope: number;
  intercept: number;
}

/**
 * Agreement of estimates (satellite) with reference values (field): n, bias = mean(e − r),
 * MAE = mean|e − r|, RMSE = √mean((e − r)²), and the ordinary least-squares regression of e on r
 * with slope = Sxy/Sxx, intercept = ē − slope·r̄ and R² = Sxy²/(Sxx·Syy). Pairs with a missing
 * member are skipped. NaN where undefined (n < 2 for the line, zero spread). Cost O(n).
 */
export function agreement(
  reference: ArrayLike<number | null | undefined>,
  estimate: ArrayLike<number | null | undefined>,
): AgreementResult {
  const { times: r, values: e } = finitePairs(reference, estimate);
  const n = r.length;
  if (n === 0)
    return {
      n,
      bias: Number.NaN,
      meanAbsoluteError: Number.NaN,
      rootMeanSquareError: Number.NaN,
      rSquared: Number.NaN,
      slope: Number.NaN,
      intercept: Number.NaN,
    };
  let sumError = 0;
  let sumAbsolute = 0;
  let sumSquared = 0;
  let meanR = 0;
  let meanE = 0;
  for (let k = 0; k < n; k++) {
    const error = (e[k] as number) - (r[k] as number);
    sumError += error;
    sumAbsolute += Math.abs(error);
    sumSquared += error * error;
    meanR += r[k] as number;
    meanE += e[k] as number;
  }
  meanR /= n;
  meanE /= n;
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  for (let k = 0; k < n; k++) {
    const dr = (r[k] as number) - meanR;
    const de = (e[k] as number) - meanE;
    sxx += dr * dr;
    syy += de * de;
    sxy += dr * de;
  }
  const slope = n >= 2 && sxx > 0 ? sxy / sxx : Number.NaN;
  return {
    n,
    bias: sumError / n,
    meanAbsoluteError: sumAbsolute / n,
    rootMeanSquareError: Math.sqrt(sumSquared / n),
    rSquared: sxx > 0 && syy > 0 ? (sxy * sxy) / (sxx * syy) : Number.NaN,
    slope,
    intercept: meanE - slope * meanR,
  };
}

export interface LogAgreementResult {
  /** Pairs with both values positive (a log needs them). */
  n: number;
  /** Median symmetric accuracy ζ = 100·(exp(median |ln Q|) − 1) %, Q = estimate / reference (Morley et al. 2018). */
  medianSymmetricAccuracy: number;
  /** Symmetric signed percentage bias = 100·sgn(M)·(exp(|M|) − 1) %, M = median(ln Q) (Morley et al. 2018). */
  symmetricSignedBias: number;
  /** Mean of log10(estimate) − log10(reference). */
  log10Bias: number;
  /** Squared Pearson correlation of log10(estimate) and log10(reference). */
  rSquaredLog10: number;
}

/**
 * Agreement on a ratio scale, for values that are roughly log-normal (chlorophyll-a, turbidity):
 * the measures of Morley, Brito & Welling (2018, Space Weather 16, 69–88) built on the log accuracy
 * ratio ln(estimate/reference), and the bias and R² of log10 values. Pairs where either value is
 * missing or not positive are skipped. NaN where undefined. Cost O(n log n) for the medians.
 */
export function logAgreement(
  reference: ArrayLike<number | null | undefined>,
  estimate: ArrayLike<number | null | undefined>,
): LogAgreementResult {
  const { times: r, values: e } = finitePairs(reference, estimate);
  const logR: number[] = [];
  const logE: number[] = [];
  for (let k = 0; k < r.length; k++) {
    if ((r[k] as number) > 0 && (e[k] as number) > 0) {
      logR.push(Math.log10(r[k] as number));
      logE.push(Math.log10(e[k] as number));
    }
  }
  const n = logR.length;
  if (n === 0)
    return { n, medianSymmetricAccuracy: Number.NaN, symmetricSignedBias: Number.NaN, log10Bias: Number.NaN, rSquaredLog10: Number.NaN };
  const lnQ = logE.map((value, k) => (value - (logR[k] as number)) * Math.LN10);
  const m = median(lnQ);
  const line = agreement(logR, logE);
  return {
    n,
    medianSymmetricAccuracy: 100 * (Math.exp(median(lnQ.map(Math.abs))) - 1),
    symmetricSignedBias: 100 * Math.sign(m) * (Math.exp(Math.abs(m)) - 1),
    log10Bias: line.bias,
    rSquaredLog10: line.rSquared,
  };
}
