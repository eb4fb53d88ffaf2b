/** Help texts and the usage error shared by the commands. */
export class UsageError extends Error {}

export const HELP = {
  main: `limnopress: turns inland-water tables into a monthly water-status bulletin site

Usage: limnopress <command> [options]

Commands:
  build <bulletin-folder> --out <dir>      check the inputs and build the bulletin site
  check <bulletin-folder>                  check the inputs only, and list every problem
  verify <site-folder>                     check a built site against its manifests
  init <folder> --month YYYY-MM            start a new bulletin folder that builds at once
  new-issue <bulletin-folder>              archive the current issue and start next month's
  preview <bulletin-folder> [--port N]     build, serve on 127.0.0.1 and rebuild on every change
  trend <table.csv> --time C --value C     trend tests for one or many series in a table
  storage <curves.csv> --area <table.csv>  water level and stored volume from surface areas
  help [command]                           show help for a command

Options:
  -h, --help       show help
  -v, --version    show the version
  --debug          on a failure, show the program's stack as well as the one-line reason
`,
  build: `Usage: limnopress build <bulletin-folder> --out <dir> [--force] [--quiet]

Checks every input of the bulletin folder, then builds the site into <dir>. The new site replaces
<dir> only when the whole build succeeded; on any error, interruption or crash <dir> is left as it
was. <dir> becomes a link to the published version, kept in .<dir>.limnopress/ beside it with the
build's lock; a second build to the same <dir> stops with a message while one is running.

<dir> must be new, empty, or a site published by limnopress. It may not be a file, a mount point,
the current folder, the home folder or /, nor overlap the bulletin folder.

Progress goes to standard error: a bar per stage on a terminal, plain lines otherwise, then a
summary of each stage's time, the rows and series per second, the pages written and the site size.
Large tables are read, and large inventories' trends tested, on one worker thread per core.

Options:
  -o, --out <dir>   where the site goes (default: _site)
  --force           publish over a non-empty folder that is not a limnopress site; that folder
                    is kept, renamed <dir>.replaced-<id>, never deleted
  -q, --quiet       print nothing but errors
  -h, --help        show this help
`,
  check: `Usage: limnopress check <bulletin-folder>

Reads bulletin.json and every table it names, and lists every problem found, grouped by file and
in line order, then a count. Nothing is written.

Exit status: 0 when there are no errors (warnings allowed), 1 when there are errors, 2 on a usage
error.

Options:
  -h, --help   show this help
`,
  init: `Usage: limnopress init <folder> --month YYYY-MM [--locales en,fr]

Writes a new bulletin folder: bulletin.json, small invented sample tables in data/ (two
sub-regions, four water bodies, 36 months up to --month), and content/foreword.md. It builds at
once; replace the samples with your own tables. The folder must be new or empty.

Options:
  --locales L   languages to publish in, comma-separated, the first at the site root
                (default en; available: en, fr); each further language gets a foreword stub
                content/foreword.<locale>.md
  -h, --help    show this help
`,
  'new-issue': `Usage: limnopress new-issue <bulletin-folder> [--published YYYY-MM-DD]

Copies the current issue (bulletin.json, every input it names, content/) into archive/YYYY-MM/,
where it keeps its address and its inputs, then moves bulletin.json on to the next month as a
draft, first revision, with a fresh foreword (and fresh translated forewords). --published sets the new issue's publication date
(default: the 3rd of the month after the new bulletin month).
`,
  preview: `Usage: limnopress preview <bulletin-folder> [--port 8080]

Builds the bulletin into a temporary folder and serves it on http://127.0.0.1:<port>/ (port 0
picks a free one). Every change in the bulletin folder rebuilds the site; a build with errors
prints them and the last good site stays served. Ctrl-C stops.
`,
  verify: `Usage: limnopress verify <site-folder>

Recomputes the SHA-256 of every file of a built site and compares it with the manifests written by
the build (manifest.json at the top, and one per issue). Lists every file that changed, is missing,
or is not listed. Exit status: 0 when everything matches, 1 otherwise, 2 on a usage error.
`,
  trend: `Usage: limnopress trend <table.csv> --time <col> --value <col> [--by <col>] [--seasonal]
                        [--format csv|json] [--confidence 0.95] [--fdr 0.05] [--workers N]

Prints one row per series. The decision comes first: method, p, p_adjusted and rejected are the
test the bulletin uses for every series, whatever its length (mann-kendall-ar1: Mann-Kendall with
its variance inflated for lag-1 autocorrelation and a t reference; with --seasonal, on calendar-
month anomalies), with p adjusted across series by Benjamini-Hochberg. Then, for comparison:
plain Mann-Kendall (S, Var(S), Z and p with and without the continuity correction, tau-b), Sen's
slope per year with its confidence interval, the Hamed & Rao test, Pettitt's change point, and
with --seasonal the seasonal Kendall test (and its covariance variant where every month has at
least 10 years) with the seasonal Sen slope.

Times may be YYYY-MM, YYYY-MM-DD or decimal years; an empty value is a missing value.

Options:
  --time <col>        the time column (required)
  --value <col>       the value column (required)
  --by <col>          the column naming each series
  --seasonal          seasonal tests, calendar months as seasons (needs monthly times)
  --format <f>        csv (default) or json
  --confidence <c>    confidence level of Sen's slope interval (default 0.95)
  --fdr <q>           false discovery rate for the adjustment (default 0.05)
  --workers <n>       worker threads for many series (default: all cores)
  -h, --help          show this help
`,
  storage: `Usage: limnopress storage <curves.csv> --area <table.csv> [--interpolation pchip|linear]
                          [--format csv|json]

Turns water surface areas into water levels and stored volumes through each reservoir's
area–elevation–volume curve, as the bulletin does. <curves.csv> has the columns body_id,
elevation_m, area_ha and volume_hm3, several rows per body (docs/input-format.md); it is checked as
in a bulletin: per body, elevation must rise, area and volume never fall, at least two rows.
<table.csv> has the columns body_id, month and water_area_ha (an empty area gives empty results);
every body must have a curve. Between a curve's rows both are read by monotone piecewise-cubic
interpolation (PCHIP, Fritsch & Carlson 1980) or, with --interpolation linear, straight lines. An
area outside its curve is taken at the curve's nearest end and marked clamped; nothing is
extrapolated. Any problem is reported with file, line and column, and nothing is printed.

Prints one row per row of <table.csv>: body_id, month, water_area_ha, level_m, volume_hm3,
percent_of_capacity (of the curve's top volume) and clamped (yes/no).

Options:
  --area <table.csv>       the table of water areas (required)
  --interpolation <how>    pchip (default) or linear
  --format <f>             csv (default) or json
  -h, --help               show this help
`,
} as const;
