/**
 * Writes the invented example region into example-bulletin/data/.
 *
 * Every name and value is made up. The region sits over open ocean in the South Atlantic so its
 * coordinates cannot be mistaken for a real place. The same seed always writes the same bytes.
 *
 * Injected signals (documented in example-bulletin/README.md, checked by later analysis tests):
 * 1. a seasonal filling cycle: fullest in April, lowest in October;
 * 2. a multi-year decline in the reservoirs of Corlas Flats (ids listed in DECLINING_IDS);
 * 3. a dry spell from December 2024 to the bulletin month: less rain, less water everywhere;
 * 4. chlorophyll-a rising year on year in bodies over 100 ha during the dry months June–September;
 * 5. turbidity following rainfall, so it peaks in the rainy months November–March.
 *
 * It also writes the archive of earlier issues (example-bulletin/archive/): September and October
 * 2026, each with its inputs cut at its own month, and October twice: revision 1 as first published
 * with one water area entered ten times too large, and revision 2 with the correction.
 *
 * Usage: npm run example:generate [-- --out <folder>]
 */
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { mulberry32 } from './random.ts';

const SEED = 20181;
const FIRST_YEAR = 2018;
const LAST_MONTH = '2026-11';
const DRY_SPELL_FROM = '2024-12';

const random = mulberry32(SEED);
const uniform = (low: number, high: number) => low + (high - low) * random();
function normal(): number {
  // Box-Muller; 1 - random() keeps the logarithm finite.
  const u = 1 - random();
  const v = random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}
const pick = <T>(items: readonly T[]): T => items[Math.floor(random() * items.length)] as T;

interface SubRegion {
  id: string;
  name: string;
  west: number;
  east: number;
  rainFactor: number;
}
const SOUTH = -31.0;
const NORTH = -29.0;
const SUB_REGIONS: SubRegion[] = [
  { id: 'ALD', name: 'Aldmoor Heights', west: -20.0, east: -19.2, rainFactor: 1.25 },
  { id: 'BRE', name: 'Brennic Vale', west: -19.2, east: -18.3, rainFactor: 1.0 },
  { id: 'COR', name: 'Corlas Flats', west: -18.3, east: -17.5, rainFactor: 0.8 },
];

/** Size classes of the inventory: [lowest ha, highest ha, how many bodies]. */
const SIZE_PLAN: Array<[number, number, number]> = [
  [1, 5, 20],
  [5, 10, 16],
  [10, 100, 22],
  [100, 10_000, 17],
  [10_000, 40_000, 5],
];

const NAME_STARTS = [
  'Tav',
  'Bris',
  'Mel',
  'Orn',
  'Quel',
  'Sav',
  'Dun',
  'Ferr',
  'Hal',
  'Ysk',
  'Lorv',
  'Pell',
  'Crand',
  'Wex',
  'Arn',
  'Gell',
];
const NAME_ENDS = ['enne', 'olt', 'ara', 'ith', 'usk', 'omere', 'avel', 'ick', 'orra', 'elby', 'anth', 'ide'];
const KIND_WORDS: Record<string, string> = { reservoir: 'Reservoir', lake: 'Lake', pond: 'Pond' };

interface Body {
  id: string;
  name: string;
  subRegion: SubRegion;
  lon: number;
  lat: number;
  referenceHa: number;
  kind: string;
  ownPage: boolean;
  baseFill: number;
  seasonalAmplitude: number;
  declining: boolean;
  chlorophyllBase: number;
  turbidityBase: number;
}

function makeBodies(): Body[] {
  const bodies: Body[] = [];
  const usedNames = new Set<string>();
  let index = 0;
  for (const [low, high, count] of SIZE_PLAN) {
    for (let k = 0; k < count; k++) {
      index++;
      const subRegion = SUB_REGIONS[index % 3] as SubRegion;
      // Log-uniform area within the class keeps small classes from bunching at their top.
      const referenceHa = Math.exp(uniform(Math.log(low), Math.log(high)));
      const kind =
        referenceHa > 100
          ? random() < 0.7
            ? 'reservoir'
            : 'lake'
          : referenceHa > 10
            ? pick(['reservoir', 'lake'])
            : pick(['lake', 'pond']);
      let stem = '';
      do stem = pick(NAME_STARTS) + pick(NAME_ENDS);
      while (usedNames.has(`${stem}${kind}`));
      usedNames.add(`${stem}${kind}`);
      const name = kind === 'lake' ? `Lake ${stem}` : `${stem} ${KIND_WORDS[kind]}`;
      bodies.push({
        id: `WB${String(index).padStart(3, '0')}`,
        name,
        subRegion,
        lon: uniform(subRegion.west + 0.08, subRegion.east - 0.08),
        lat: uniform(SOUTH + 0.05, NORTH - 0.05),
        referenceHa,
        kind,
        ownPage: referenceHa > 100,
        baseFill: uniform(0.72, 0.86),
        seasonalAmplitude: kind === 'reservoir' ? uniform(0.08, 0.14) : uniform(0.03, 0.08),
        declining: subRegion.id === 'COR' && kind === 'reservoir',
        chlorophyllBase: Math.exp(uniform(Math.log(3), Math.log(25))) * (referenceHa < 10 ? 1.4 : 1),
        turbidityBase: uniform(2, 12),
      });
    }
  }
  return bodies;
}

function months(): string[] {
  const list: string[] = [];
  for (let year = FIRST_YEAR; ; year++) {
    for (let month = 1; month <= 12; month++) {
      const label = `${year}-${String(month).padStart(2, '0')}`;
      list.push(label);
      if (label === LAST_MONTH) return list;
    }
  }
}

const monthOf = (label: string) => Number(label.slice(5, 7));
const yearsSince2018 = (label: string) => Number(label.slice(0, 4)) - FIRST_YEAR + (monthOf(label) - 1) / 12;
const isWet = (month: number) => month >= 11 || month <= 3;
const isDry = (month: number) => month >= 6 && month <= 9;
const fixed = (value: number, digits: number) => value.toFixed(digits);

/** Months since the dry spell began, or -1 before it. */
function drySpellAge(label: string): number {
  const [y0, m0] = DRY_SPELL_FROM.split('-').map(Number) as [number, number];
  const [y, m] = label.split('-').map(Number) as [number, number];
  return (y - y0) * 12 + (m - m0);
}

function rainfallTable(monthList: string[]): { rows: string[]; bySubRegion: Map<string, Map<string, number>> } {
  const rows = ['subregion_id,month,rainfall_mm'];
  const bySubRegion = new Map<string, Map<string, number>>();
  for (const subRegion of SUB_REGIONS) {
    const series = new Map<string, number>();
    for (const label of monthList) {
      const month = monthOf(label);
      const climate = isWet(month) ? 125 : isDry(month) ? 14 : 55;
      const spell = drySpellAge(label) >= 0 ? 0.55 : 1;
      const value = Math.max(0, climate * subRegion.rainFactor * spell * Math.exp(0.35 * normal()));
      series.set(label, value);
      rows.push(`${subRegion.id},${label},${fixed(value, 1)}`);
    }
    bySubRegion.set(subRegion.id, series);
  }
  return { rows, bySubRegion };
}

function fillFraction(body: Body, label: string): number {
  const month = monthOf(label);
  const seasonal = body.seasonalAmplitude * Math.cos((2 * Math.PI * (month - 4)) / 12);
  const decline = body.declining ? 0.035 * yearsSince2018(label) : 0;
  const age = drySpellAge(label);
  const spell = age < 0 ? 0 : 0.16 * Math.min(1, (age + 1) / 4);
  return Math.min(1, Math.max(0.05, body.baseFill + seasonal - decline - spell + 0.02 * normal()));
}

/** Share of the body seen through clouds; null when the month has no usable scene at all. */
function observedShare(label: string): number | null {
  const wet = isWet(monthOf(label));
  if (random() < (wet ? 0.07 : 0.02)) return null;
  const cloudy = random() < (wet ? 0.3 : 0.1);
  return cloudy ? uniform(0.05, 0.85) : uniform(0.9, 1);
}

function main(): void {
  const outIndex = process.argv.indexOf('--out');
  const outDir = outIndex > 0 ? (process.argv[outIndex + 1] ?? '') : join('example-bulletin', 'data');
  mkdirSync(outDir, { recursive: true });

  const bodies = makeBodies();
  const monthList = months();
  const rain = rainfallTable(monthList);

  const inventory = ['body_id,name,subregion_id,lon,lat,reference_area_ha,kind,own_page'];
  for (const body of bodies) {
    inventory.push(
      [
        body.id,
        body.name,
        body.subRegion.id,
        fixed(body.lon, 5),
        fixed(body.lat, 5),
        fixed(body.referenceHa, 2),
        body.kind,
        body.ownPage ? 'yes' : 'no',
      ].join(','),
    );
  }

  const area = ['body_id,month,water_area_ha,observed_share,scenes'];
  const quality = ['body_id,month,parameter,unit,p10,p25,median,p75,p90,valid_pixels'];
  const satelliteChlorophyll = new Map<string, number>();
  const satelliteTurbidity = new Map<string, number>();
  for (const body of bodies) {
    for (const label of monthList) {
      const share = observedShare(label);
      const fill = fillFraction(body, label);
      if (share === null) continue;
      // The upstream chain estimates the hidden part of the body; the less it saw, the noisier.
      const estimate = fill * body.referenceHa * (1 + (1 - share) * 0.15 * normal());
      const scenes = 1 + Math.floor(random() * (isWet(monthOf(label)) ? 3 : 6));
      area.push(`${body.id},${label},${fixed(Math.max(0, estimate), 2)},${fixed(share, 3)},${scenes}`);
      if (share < 0.3) continue;

      const month = monthOf(label);
      const dryBoost = body.referenceHa > 100 && isDry(month) ? Math.exp(0.09 * yearsSince2018(label)) : 1;
      const seasonalChl = 1 + 0.35 * Math.sin((2 * Math.PI * (month - 5)) / 12);
      const chlorophyll = body.chlorophyllBase * seasonalChl * dryBoost * Math.exp(0.18 * normal());
      const rainfall = rain.bySubRegion.get(body.subRegion.id)?.get(label) ?? 0;
      const turbidity = body.turbidityBase * (1 + rainfall / 90) * Math.exp(0.15 * normal());
      const pixels = Math.max(1, Math.round(fill * body.referenceHa * share * 100));
      for (const [parameter, unit, median, spread] of [
        ['chlorophyll_a', 'ug/L', chlorophyll, 0.45],
        ['turbidity', 'FNU', turbidity, 0.35],
      ] as Array<[string, string, number, number]>) {
        // Quantiles of a log-normal pixel distribution around the median (z of 10 % and 25 %).
        const q = (z: number) => fixed(median * Math.exp(z * spread), 2);
        quality.push([body.id, label, parameter, unit, q(-1.2816), q(-0.6745), fixed(median, 2), q(0.6745), q(1.2816), pixels].join(','));
      }
      satelliteChlorophyll.set(`${body.id} ${label}`, chlorophyll);
      satelliteTurbidity.set(`${body.id} ${label}`, turbidity);
    }
  }

  const field = ['body_id,date,parameter,value,unit'];
  const sampled = bodies.filter((body) => body.ownPage).slice(0, 6);
  for (const body of sampled) {
    for (const label of monthList) {
      if (Number(label.slice(0, 4)) < 2020 || random() < 0.4) continue;
      const day = 1 + Math.floor(random() * 28);
      const date = `${label}-${String(day).padStart(2, '0')}`;
      const chlorophyll = satelliteChlorophyll.get(`${body.id} ${label}`);
      const turbidity = satelliteTurbidity.get(`${body.id} ${label}`);
      // Field values scatter around the satellite estimate with a small positive bias.
      if (chlorophyll !== undefined)
        field.push(`${body.id},${date},chlorophyll_a,${fixed(chlorophyll * 1.08 * Math.exp(0.2 * normal()), 2)},ug/L`);
      if (turbidity !== undefined) field.push(`${body.id},${date},turbidity,${fixed(turbidity * 0.95 * Math.exp(0.25 * normal()), 2)},FNU`);
    }
  }

  const features = SUB_REGIONS.map((subRegion) => ({
    type: 'Feature',
    properties: { subregion_id: subRegion.id, name: subRegion.name },
    geometry: { type: 'Polygon', coordinates: [boundaryRing(subRegion)] },
  }));
  const geojson = JSON.stringify({ type: 'FeatureCollection', features });

  const write = (name: string, lines: string[]) => writeFileSync(join(outDir, name), `${lines.join('\n')}\n`);
  write('water-bodies.csv', inventory);
  write('surface-area.csv', area);
  write('water-quality.csv', quality);
  write('rainfall.csv', rain.rows);
  write('field-measurements.csv', field);
  const curves = storageCurves(bodies);
  write('storage-curves.csv', curves.rows);
  write('storage-fits.csv', storageFits(curves.unsurveyed.slice(0, 2)));
  writeFileSync(join(outDir, 'subregions.geojson'), `${geojson}\n`);
  if (outIndex < 0) writeArchive(join('example-bulletin'), { inventory, area, quality, rainfall: rain.rows, field }, geojson);
  process.stdout.write(
    `wrote ${bodies.length} water bodies, ${area.length - 1} surface-area rows, ${quality.length - 1} quality rows and ${field.length - 1} field measurements to ${outDir}\n`,
  );
  process.stdout.write(
    `declining reservoirs: ${bodies
      .filter((body) => body.declining)
      .map((body) => body.id)
      .join(' ')}\n`,
  );
}

/**
 * Invented area–elevation–volume curves for the reservoirs, from their own generator (so the other
 * tables stay as they were): a basin whose area grows as a power p of the depth (p = 1 is a
 * paraboloid, p = 2 a cone), A(h) = Amax (h/H)^p, so V(h) = Amax H (h/H)^(p+1) / (p + 1), surveyed
 * at 9 levels from the bed to the spillway (Amax = 1.45 × the reference area, above every area the
 * example observes). One reservoir in five has no curve, as at an agency where some are unsurveyed.
 * 1 ha·m = 0.01 hm³.
 */
function storageCurves(bodies: Body[]): { rows: string[]; unsurveyed: Body[] } {
  const draw = mulberry32(SEED + 18);
  const rows = ['body_id,elevation_m,area_ha,volume_hm3'];
  const unsurveyed: Body[] = [];
  for (const body of bodies) {
    if (body.kind !== 'reservoir') continue;
    const skip = draw() < 0.2;
    const depth = 6 + draw() * 30;
    const power = 0.8 + draw() * 1.2;
    const bed = Math.round(180 + draw() * 400);
    if (skip) {
      unsurveyed.push(body);
      continue;
    }
    const maxArea = 1.45 * body.referenceHa;
    for (let k = 0; k <= 8; k++) {
      const h = (depth * k) / 8;
      const share = h / depth;
      const area = maxArea * share ** power;
      const volume = (0.01 * maxArea * depth * share ** (power + 1)) / (power + 1);
      rows.push(`${body.id},${(bed + h).toFixed(2)},${area.toFixed(2)},${volume.toFixed(4)}`);
    }
  }
  return { rows, unsurveyed };
}

/**
 * Fitted power laws V = a·A^b for two reservoirs without a curve, from the same basin shape with
 * p = 1.5 and a depth of 15 m: h = H (A/Amax)^(1/p), so V = 0.01 Amax H / (p + 1) · (A/Amax)^((p+1)/p),
 * that is b = (p + 1)/p and a = 0.01 Amax H / (p + 1) / Amax^b.
 */
function storageFits(bodies: Body[]): string[] {
  const rows = ['body_id,coefficient,exponent,min_area_ha,max_area_ha'];
  const power = 1.5;
  const depth = 15;
  for (const body of bodies) {
    const maxArea = 1.45 * body.referenceHa;
    const exponent = (power + 1) / power;
    const coefficient = (0.01 * maxArea * depth) / (power + 1) / maxArea ** exponent;
    rows.push(`${body.id},${coefficient.toPrecision(6)},${exponent.toPrecision(6)},0,${maxArea.toFixed(2)}`);
  }
  return rows;
}

interface Tables {
  inventory: string[];
  area: string[];
  quality: string[];
  rainfall: string[];
  field: string[];
}

/** Rows of a table whose month column (or date) is at most `month` (YYYY-MM); the header stays. */
function upTo(rows: string[], column: number, month: string): string[] {
  return rows.filter((row, k) => k === 0 || (row.split(',')[column] ?? '').slice(0, 7) <= month);
}

const ARCHIVE: Array<{
  folder: string;
  month: string;
  published: string;
  revision: number;
  corrections: Array<{ date: string; text: string; translations?: Record<string, string> }>;
  tenfold?: string;
}> = [
  { folder: '2026-09', month: '2026-09', published: '2026-10-02', revision: 1, corrections: [] },
  { folder: '2026-10-r1', month: '2026-10', published: '2026-11-03', revision: 1, corrections: [], tenfold: 'WB079,2026-10,' },
  {
    folder: '2026-10',
    month: '2026-10',
    published: '2026-11-10',
    revision: 2,
    corrections: [
      {
        date: '2026-11-10',
        text: 'The October 2026 water area of water body WB079 had been entered ten times too large. All figures of this issue are recomputed with the corrected value.',
        translations: {
          fr: 'La surface en eau d’octobre 2026 du plan d’eau WB079 avait été saisie dix fois trop grande. Tous les chiffres de ce numéro sont recalculés avec la valeur corrigée.',
        },
      },
    ],
  },
];

function writeArchive(root: string, tables: Tables, geojson: string): void {
  const config = JSON.parse(readFileSync(join(root, 'bulletin.json'), 'utf8')) as Record<string, unknown> & {
    issue: Record<string, unknown>;
    inputs: Record<string, string>;
    site: Record<string, unknown>;
  };
  rmSync(join(root, 'archive'), { recursive: true, force: true });
  for (const issue of ARCHIVE) {
    const folder = join(root, 'archive', issue.folder);
    mkdirSync(join(folder, 'data'), { recursive: true });
    let area = upTo(tables.area, 1, issue.month);
    if (issue.tenfold) {
      area = area.map((row) => {
        if (!row.startsWith(issue.tenfold as string)) return row;
        const cells = row.split(',');
        cells[2] = (Number(cells[2]) * 10).toFixed(2);
        return cells.join(',');
      });
    }
    const write = (name: string, rows: string[]) => writeFileSync(join(folder, 'data', name), `${rows.join('\n')}\n`);
    write('water-bodies.csv', tables.inventory);
    write('surface-area.csv', area);
    write('water-quality.csv', upTo(tables.quality, 1, issue.month));
    write('rainfall.csv', upTo(tables.rainfall, 1, issue.month));
    write('field-measurements.csv', upTo(tables.field, 1, issue.month));
    writeFileSync(join(folder, 'data', 'subregions.geojson'), `${geojson}\n`);
    // The survey curves arrived with the current issue: archived issues were published without them.
    const { storageCurves: _curves, storageFits: _fits, ...inputs } = config.inputs as Record<string, string>;
    // The logo too: archived issues were published before it (the site shows the current issue's on every page).
    const { logo: _logo, ...site } = config.site as Record<string, unknown>;
    const issueConfig = {
      ...config,
      site,
      inputs,
      issue: { ...config.issue, month: issue.month, published: issue.published, revision: issue.revision, corrections: issue.corrections },
    };
    writeFileSync(join(folder, 'bulletin.json'), `${JSON.stringify(issueConfig, null, 2)}\n`);
  }
}

/**
 * A boundary ring, counter-clockwise as RFC 7946 asks of exterior rings. Shared edges carry the same
 * wobble points on both sides so neighbouring sub-regions meet without gaps.
 */
function boundaryRing(subRegion: SubRegion): number[][] {
  const wobble = (x: number) => Math.round(0.06 * Math.sin(x * 7.3) * 1e5) / 1e5;
  const edge = (lon: number) =>
    [0, 1, 2, 3, 4].map((k) => [Math.round((lon + wobble(k + lon)) * 1e5) / 1e5, SOUTH + ((NORTH - SOUTH) * k) / 4]);
  const westEdge =
    subRegion.west === -20.0
      ? [
          [-20.0, SOUTH],
          [-20.0, NORTH],
        ]
      : edge(subRegion.west);
  const eastEdge =
    subRegion.east === -17.5
      ? [
          [-17.5, SOUTH],
          [-17.5, NORTH],
        ]
      : edge(subRegion.east);
  // South-east → north-east → north-west → south-west and back: counter-clockwise.
  const ring = [...eastEdge, ...[...westEdge].reverse()] as number[][];
  ring.push([...(ring[0] as number[])]);
  return ring;
}

main();
