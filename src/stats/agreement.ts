import { finitePairs } from './finiteValues.ts';

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
