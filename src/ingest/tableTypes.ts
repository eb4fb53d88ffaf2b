/** The shapes of the tables the readers hand on (tables.ts, and the fast path in largeTables.ts). */
import type { DecimalMark } from './cells.ts';
import type { ProblemList } from './problems.ts';

export interface WaterBody {
  id: string;
  name: string;
  subRegionId: string;
  lon: number;
  lat: number;
  referenceHa: number;
  kind: string;
  ownPage: boolean;
  /** Line in the inventory file. */
  line: number;
}

/** Surface area by body and month, one entry per row, as columns. */
export interface AreaTable {
  length: number;
  /** Position of the body in the inventory. */
  body: Int32Array;
  month: Int32Array;
  /** NaN for a month not seen at all (an empty area with an observed share of 0). */
  waterHa: Float64Array;
  observedShare: Float64Array;
  scenes: Float64Array;
}

/**
 * One body's area–elevation–volume curve (inputs.storageCurves), sorted by elevation: elevation
 * strictly rising, area and volume never falling.
 */
export interface StorageCurve {
  /** Position of the body in the inventory (in the file, without one). */
  body: number;
  id: string;
  elevationM: Float64Array;
  areaHa: Float64Array;
  volumeHm3: Float64Array;
  /** Line of the body's first row in the curves file. */
  line: number;
}

/**
 * A body's fitted area–volume power law (inputs.storageFits): V = coefficient × A^exponent, V in hm³
 * and A in ha, valid from minAreaHa to maxAreaHa (the range of the survey it was fitted to). An
 * estimate with no elevation, so it gives a volume but no level.
 */
export interface StorageFit {
  body: number;
  id: string;
  coefficient: number;
  exponent: number;
  minAreaHa: number;
  maxAreaHa: number;
  line: number;
}

export const QUALITY_PARAMETERS = ['chlorophyll_a', 'turbidity'] as const;
export type QualityParameter = (typeof QUALITY_PARAMETERS)[number];
/**
 * Accepted spellings of each parameter's unit (1 mg/m³ of chlorophyll-a is 1 µg/L). Turbidity may
 * be in FNU (formazin nephelometric units: infrared light, ISO 7027) or NTU (nephelometric
 * turbidity units: white light, US EPA Method 180.1). They are not interchangeable, so the unit is
 * kept, one table holds one of them, and values in different units are never compared.
 */
export const QUALITY_UNITS: Record<QualityParameter, string[]> = {
  chlorophyll_a: ['ug/L', 'µg/L', 'μg/L', 'mg/m3', 'mg/m³'],
  turbidity: ['FNU', 'NTU'],
};
export const TURBIDITY_UNITS = ['FNU', 'NTU'] as const;
export type TurbidityUnit = (typeof TURBIDITY_UNITS)[number];

export interface QualityTable {
  length: number;
  body: Int32Array;
  month: Int32Array;
  /** Index into QUALITY_PARAMETERS. */
  parameter: Int32Array;
  /**
   * The body's median for the month. The other percentiles are checked (range, order) but not
   * kept: nothing downstream reads them, and at national scale they would cost 32 bytes a row.
   */
  median: Float64Array;
  /**
   * Valid pixels behind the median (quality.minValidPixels decides whether it is used); NaN when
   * the table has no valid_pixels column. 32-bit: counts are whole numbers, exact up to 16 million,
   * and at national scale the column costs 4 bytes a row rather than 8.
   */
  validPixels: Float32Array;
  /** The unit of the table's turbidity rows (one unit a table); null when it has none. */
  turbidityUnit: TurbidityUnit | null;
}

export interface RainfallRecord {
  subRegionId: string;
  month: number;
  rainfallMm: number;
  line: number;
}

export interface FieldRecord {
  bodyId: string;
  body: number;
  /** Days since 1970-01-01. */
  day: number;
  month: number;
  parameter: QualityParameter;
  value: number;
  /** For turbidity, the sample's unit: compared only with satellite values in the same unit. */
  turbidityUnit?: TurbidityUnit;
  line: number;
}

export interface DistributionBin {
  subRegionId: string;
  month: number;
  parameter: QualityParameter;
  lower: number;
  upper: number;
  count: number;
  line: number;
}

export interface ReadContext {
  problems: ProblemList;
  bulletinMonth: number;
  decimal: DecimalMark | 'auto';
  /** Columns to skip without a warning (tables.ignoreColumns). */
  ignoreColumns?: string[];
  /** false: always the general reader (tests compare the two paths). Default true. */
  fastPath?: boolean;
  /** Told what is being read, for progress on the terminal. */
  onStep?: (detail: string) => void;
}
