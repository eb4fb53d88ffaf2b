/**
 * A large invented inventory for the build benchmark: a bulletin folder with N water bodies (100,000
 * by default) in ten invented sub-regions over open ocean in the South Pacific, and M months (120 by
 * default) of surface area and water quality, written as CSV. Every name and value is made up; the
 * same seed writes the same bytes. Not committed: bench:build writes it into .bench/.
 *
 * Shape of the data, chosen to look like an inventory mapped from satellite water masks:
 * - sizes from a heavy-tailed law (most bodies are ponds of a few hectares, a few are large
 *   reservoirs), 2 % of the bodies flagged for a page of their own;
 * - a seasonal filling cycle, a slow decline in one sub-region, 4 % of months missing and 15 %
 *   partly seen through clouds;
 * - chlorophyll-a and turbidity percentiles for every month seen at least half.
 *
 * Usage: tsx scripts/bench/national.ts --out <folder> [--bodies 100000] [--months 120]
 */
import { closeSync, mkdirSync, openSync, writeFileSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { mulberry32 } from '../random.ts';

export interface NationalOptions {
  bodies: number;
  months: number;
  seed?: number;
}

export interface NationalSummary {
  bodies: number;
  months: number;
  areaRows: number;
  qualityRows: number;
  bytes: number;
}

const BULLETIN_MONTH = 2026 * 12 + 10; // 2026-11
const SOUTH = -42;
const NORTH = -36;
const WEST = -140;
const STRIP = 2; // degrees of longitude per sub-region
const SUB_REGIONS = [
  'Tavelmoor',
  'Briskenfold',
  'Quellith Plain',
  'Savorra Downs',
  'Dunavel Reach',
  'Ferrick Uplands',
  'Halanth Marsh',
  'Yskelby Vale',
  'Lorvide Coast',
  'Pellomere Flats',
].map((name, k) => ({ id: `SR${String(k + 1).padStart(2, '0')}`, name, west: WEST + k * STRIP }));
const STARTS = ['Tav', 'Bris', 'Mel', 'Orn', 'Quel', 'Sav', 'Dun', 'Ferr', 'Hal', 'Ysk', 'Lorv', 'Pell', 'Crand', 'Wex', 'Arn', 'Gell'];
const ENDS = ['enne', 'olt', 'ara', 'ith', 'usk', 'omere', 'avel', 'ick', 'orra', 'elby', 'anth', 'ide'];

const label = (month: number) => `${Math.floor(month / 12)}-${String((month % 12) + 1).padStart(2, '0')}`;

/** Buffered writes of large text files: one system call per 4 MB. */
class TextFile {
  private readonly fd: number;
  private parts: string[] = [];
  private size = 0;
  bytes = 0;
  constructor(path: string) {
    this.fd = openSync(path, 'w');
  }
  write(text: string): void {
    this.parts.push(text);
    this.size += text.length;
    if (this.size > 4 << 20) this.flush();
  }
  flush(): void {
    const chunk = this.parts.join('');
    this.bytes += writeSync(this.fd, chunk);
    this.parts = [];
    this.size = 0;
  }
  close(): void {
    this.flush();
    closeSync(this.fd);
  }
}

export function generateNational(folder: string, options: NationalOptions): NationalSummary {
  const random = mulberry32(options.seed ?? 100_000);
  const normal = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  const firstMonth = BULLETIN_MONTH - options.months + 1;
  mkdirSync(join(folder, 'data'), { recursive: true });

  const features = SUB_REGIONS.map((region) => ({
    type: 'Feature',
    properties: { subregion_id: region.id, name: region.name },
    geometry: {
      type: 'Polygon',
      coordinates: [
        [
          [region.west, SOUTH],
          [region.west + STRIP, SOUTH],
          [region.west + STRIP, NORTH],
          [region.west, NORTH],
          [region.west, SOUTH],
        ],
      ],
    },
  }));
  writeFileSync(join(folder, 'data', 'subregions.geojson'), `${JSON.stringify({ type: 'FeatureCollection', features })}\n`);

  const inventory = new TextFile(join(folder, 'data', 'water-bodies.csv'));
  const area = new TextFile(join(folder, 'data', 'surface-area.csv'));
  const quality = new TextFile(join(folder, 'data', 'water-quality.csv'));
  inventory.write('body_id,name,subregion_id,lon,lat,reference_area_ha,kind,own_page\n');
  area.write('body_id,month,water_area_ha,observed_share,scenes\n');
  quality.write('body_id,month,parameter,unit,p10,p25,median,p75,p90,valid_pixels\n');
  let areaRows = 0;
  let qualityRows = 0;
  for (let k = 0; k < options.bodies; k++) {
    const id = `N${String(k + 1).padStart(6, '0')}`;
    const region = SUB_REGIONS[k % SUB_REGIONS.length] as (typeof SUB_REGIONS)[number];
    // Pareto-like sizes: half the bodies under 2.7 ha, one in a thousand over 1,000 ha.
    const referenceHa = Math.min(50_000, Math.exp(-Math.log(1 - random()) * 1.45));
    const kind = referenceHa > 100 ? 'reservoir' : referenceHa > 10 ? 'lake' : 'pond';
    const name = `${STARTS[Math.floor(random() * STARTS.length)]}${ENDS[Math.floor(random() * ENDS.length)]} ${kind[0]?.toUpperCase()}${kind.slice(1)} ${k + 1}`;
    const lon = region.west + 0.05 + random() * (STRIP - 0.1);
    const lat = SOUTH + 0.05 + random() * (NORTH - SOUTH - 0.1);
    inventory.write(
      `${id},${name},${region.id},${lon.toFixed(5)},${lat.toFixed(5)},${referenceHa.toFixed(2)},${kind},${random() < 0.02 ? 'yes' : 'no'}\n`,
    );

    const baseFill = 0.6 + 0.35 * random();
    const amplitude = 0.05 + 0.15 * random();
    const decline = region.id === 'SR03' ? 0.02 * random() : 0; // share of the reference lost per year
    const chlorophyll = Math.exp(1 + 1.2 * random());
    const turbidity = Math.exp(1.5 + random());
    const pixels = Math.max(4, Math.round(referenceHa * 25));
    let areaText = '';
    let qualityText = '';
    for (let month = firstMonth; month <= BULLETIN_MONTH; month++) {
      if (random() < 0.04) continue; // no usable scene
      const season = Math.cos((2 * Math.PI * ((month % 12) - 3)) / 12); // fullest in April
      const years = (month - firstMonth) / 12;
      const fill = Math.min(1, Math.max(0.05, baseFill + amplitude * season - decline * years + 0.03 * normal()));
      const observed = random() < 0.15 ? 0.2 + 0.6 * random() : 0.9 + 0.1 * random();
      areaText += `${id},${label(month)},${(referenceHa * fill).toFixed(2)},${observed.toFixed(3)},${1 + Math.floor(random() * 5)}\n`;
      areaRows++;
      if (observed < 0.5) continue;
      const valid = Math.max(1, Math.round(pixels * observed));
      const chl = chlorophyll * Math.exp(0.3 * normal() - 0.2 * season);
      const tur = turbidity * Math.exp(0.25 * normal() + 0.3 * season);
      qualityText += `${id},${label(month)},chlorophyll_a,ug/L,${(chl * 0.55).toFixed(2)},${(chl * 0.75).toFixed(2)},${chl.toFixed(2)},${(chl * 1.3).toFixed(2)},${(chl * 1.7).toFixed(2)},${valid}\n`;
      qualityText += `${id},${label(month)},turbidity,FNU,${(tur * 0.6).toFixed(2)},${(tur * 0.8).toFixed(2)},${tur.toFixed(2)},${(tur * 1.25).toFixed(2)},${(tur * 1.6).toFixed(2)},${valid}\n`;
      qualityRows += 2;
    }
    area.write(areaText);
    quality.write(qualityText);
  }
  inventory.close();
  area.close();
  quality.close();

  const config = {
    title: 'Ossary Basin Water Bulletin (benchmark)',
    publisher: 'An invented agency, for the build benchmark',
    region: { name: 'Ossary Basin' },
    issue: { month: label(BULLETIN_MONTH), revision: 1, published: '2026-12-03', draft: false },
    baseline: { firstYear: Math.floor(firstMonth / 12) + 1, lastYear: Math.floor(firstMonth / 12) + 5, minYears: 3 },
    coverage: { minObservedShare: 0.6, minRegionCoverage: 0.5 },
    statusBands: [
      { key: 'much-lower', fromPercent: null },
      { key: 'lower', fromPercent: 75 },
      { key: 'near', fromPercent: 90 },
      { key: 'higher', fromPercent: 110 },
      { key: 'much-higher', fromPercent: 125 },
    ],
    site: { baseUrl: 'https://bench.example.org/' },
    locales: ['en'],
    quality: {
      seasons: [
        { key: 'dry', months: [6, 7, 8, 9] },
        { key: 'wet', months: [11, 12, 1, 2, 3] },
      ],
    },
    inputs: {
      inventory: 'data/water-bodies.csv',
      surfaceArea: 'data/surface-area.csv',
      quality: 'data/water-quality.csv',
      boundaries: 'data/subregions.geojson',
    },
  };
  writeFileSync(join(folder, 'bulletin.json'), `${JSON.stringify(config, null, 2)}\n`);
  return { bodies: options.bodies, months: options.months, areaRows, qualityRows, bytes: inventory.bytes + area.bytes + quality.bytes };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { values } = parseArgs({
    options: {
      out: { type: 'string' },
      bodies: { type: 'string', default: '100000' },
      months: { type: 'string', default: '120' },
      help: { type: 'boolean', short: 'h' },
    },
  });
  if (values.help || !values.out) {
    process.stdout.write('Usage: tsx scripts/bench/national.ts --out <folder> [--bodies 100000] [--months 120]\n');
    process.exit(values.help ? 0 : 2);
  }
  const summary = generateNational(values.out, { bodies: Number(values.bodies), months: Number(values.months) });
  process.stdout.write(
    `${summary.bodies} bodies, ${summary.areaRows} surface-area rows, ${summary.qualityRows} quality rows, ${(summary.bytes / 1e6).toFixed(0)} MB in ${values.out}\n`,
  );
}
