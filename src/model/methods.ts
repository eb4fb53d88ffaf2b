/**
 * The methods the model's figures rest on, by id. Each figure names its method; the data & methods
 * page prints this table, so every number on the site can be traced to a written rule.
 */
export const METHODS = {
  'filling-ratio': 'Filling of a group of water bodies in a month: the sum of their water areas divided by the sum of their reference areas, over the bodies with a value that month (seen through clouds over at least the minimum share, or filled from a short gap). Coverage is the share of the group\'s reference area actually seen.',
  'gap-filling': 'A body-month seen over less than the minimum share counts as missing. Gaps of up to the configured number of months between two seen months are filled by linear interpolation in time and flagged; longer gaps stay missing.',
  status: 'The bulletin month against the same calendar month in the baseline years: median and 10th–90th percentiles (Hyndman & Fan type 7), percent of the median, standardized anomaly (against mean and sample standard deviation), percentile rank (mean definition), and the status band from the configured thresholds on percent of the median.',
  'size-class-loss': 'Loss from maximum filling of a size class: 100 % minus its filling, the share of its reference area that is dry; compared with 100 % minus its baseline median filling.',
  grid: 'Water bodies grouped into square cells by their point location; each cell aggregated as a group and compared with its baseline mean and sample standard deviation for the calendar month. Cells with too few bodies, too little coverage or too short a baseline are marked.',
  'trend-bodies': 'Per water body, over the whole record of seen months: Kruskal-Wallis across calendar months decides seasonality (p below the configured level). Seasonal series: seasonal Kendall test (Hirsch, Slack & Smith 1982; with the Hirsch & Slack 1984 covariance correction where every month has 10 years) and seasonal Sen slope. Other series: Mann-Kendall with the Hamed & Rao (1998) autocorrelation correction and Sen\'s slope. p values adjusted across bodies by Benjamini & Hochberg (1995); a decline or rise is counted only when its adjusted p is within the false discovery rate.',
  'trend-region': 'The regional filling series tested as for a water body.',
  'change-point': 'Pettitt (1979) test on the regional series with the seasonal cycle removed (each month minus the median of its calendar month).',
  'quality-medians': 'Region medians per month of the body medians of valid pixels: plain (each body once) and weighted by reference area.',
  'quality-classes': '10th, 25th, 50th, 75th and 90th percentiles (type 7) of the bulletin month\'s body medians within each quality size class.',
  trophic: 'Carlson (1977) trophic state index from chlorophyll-a in the original form TSI = 10 (6 − (2.04 − 0.68 ln Chl) / ln 2); trophic classes on the OECD (1982) fixed boundaries for chlorophyll-a (1, 2.5, 8, 25 µg/L), applied to one month\'s estimate.',
  'who-levels': 'Share of water bodies with a chlorophyll-a estimate whose median exceeds the WHO (2003) recreational guidance levels of 10 and 50 µg/L. A satellite estimate of algae, not a toxin test.',
  validation: 'Field samples matched to the satellite median of the month containing the sample date, or of the neighbouring month when the sample lies within the configured window of it; n, bias (satellite − field), MAE, RMSE, R² and the least-squares line of satellite on field.',
  rainfall: 'Rainfall per sub-region and month as supplied; the bulletin month as percent of the median of its calendar month in the baseline years.',
  evidence: 'Words for the strength of evidence from a p value: below 0.001 very strong, below 0.01 strong, below 0.05 moderate, below 0.1 weak, otherwise little or no evidence (Muff et al. 2022). They describe evidence against "no trend", not the probability that a statement is true.',
} as const;
