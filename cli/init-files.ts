// The starter folder `tidewright init` writes: settings, one invented reference port and one secondary
// port at sea (mid-ocean, far from any coast, with a time zone that fits the longitude), and a short
// README for the publisher. Every file here must pass `tidewright check` (tests/cli/init.test.ts).

export const STARTER_FILES: Readonly<Record<string, string>> = {
  'tidewright.yaml': `# tidewright.yaml: the settings of this almanac. Every key is optional; delete a line to use the
# default shown in its comment. Options given to \`tidewright build\` win over these.

# Title on the book covers and the website.
title: "Storm Petrel Bank Tide Tables (invented example)"

# Who publishes it: printed on the covers and at the top of every web page.
publisher: "Storm Petrel Bank Harbour Office (invented)"

# Year of the almanac; leave it out to build next calendar year. A range such as
# 2027-2029 builds every year of it (at most 10) into one site with a year switch.
# year: 2027

# Page size of the PDF books: a5, a6, a4, letter or half-letter (default a5).
page: a5

# Heights in metres (m) or feet (ft) (default m).
units: m

# Language tag for dates and numbers, e.g. en-GB, en-US, fr, pt-PT.
locale: en-GB

# none, or saddle-stitch to print the books as fold-and-staple booklets (default none).
imposition: none

# Your own safety caution in plain text, replacing the built-in one (translated for each language).
# Every output carries it, so it cannot be empty.
# caution: "Predictions only. Check the official tide tables and local notices; ask the harbour office."

# Date of this edition, YYYY-MM-DD: every output is stamped with it (the PDF books' date, the calendar
# files, the website's edition line). Left out: 1 January of the year. SOURCE_DATE_EPOCH, when set,
# is used instead, but never a date after the edition.
# edition: 2026-11-15

# Accent colour as "#rrggbb": the website's masthead, headings and links, and the books' covers and
# page titles; refused if white text on it reads below 4.5:1. Left out: the site's own blue.
# accent: "#0b5d7a"

# Your logo, as SVG, PNG or JPEG, path relative to this file: in the website's header and at the top
# of the book covers.
# logo: brand/logo.png

# A photo or drawing (JPEG, PNG or SVG) for the book covers and the website's front page.
# cover_image: brand/cover.jpg

# A folder of your own pages in Markdown (a welcome, harbour rules, sponsors): in the books and on
# the website. See pages/welcome.md for what a page says at its top.
pages: pages/

# Who to call, one to four lines: printed on the imprint page of every book and in the website's footer.
contact: |
  Storm Petrel Bank Harbour Office (invented), Quay Road
  +00 0000 0000 · office@example.invalid
`,

  'storm-petrel-bank.yaml': `# INVENTED example reference port, in open ocean far from any coast: replace it with your own.
# Harmonic constants: amplitude in metres, Greenwich phase lag in degrees (UTC).
id: storm-petrel-bank
name: Storm Petrel Bank (invented)
kind: reference
position: { latitude: 36.5, longitude: -38.0 }
timezone: America/Noronha
datum: Chart Datum
mean_level: 2.0
constituents:
  M2: { amplitude: 1.200, phase: 60.0 }
  S2: { amplitude: 0.420, phase: 95.0 }
  N2: { amplitude: 0.250, phase: 40.0 }
  K2: { amplitude: 0.115, phase: 95.0 }
  K1: { amplitude: 0.090, phase: 200.0 }
  O1: { amplitude: 0.065, phase: 190.0 }
  P1: { amplitude: 0.030, phase: 200.0 }
  Q1: { amplitude: 0.013, phase: 180.0 }
  M4: { amplitude: 0.030, phase: 120.0 }
  MS4: { amplitude: 0.020, phase: 170.0 }
provenance: "Invented for the tidewright starter folder: not a real place, not real constants"
number: "0001"
datum_authority: "Invented Hydrographic Service"
`,

  'shearwater-shoal.yaml': `# INVENTED example secondary port: its tides are those of the reference port, shifted by the time
# differences (minutes, + later) and height differences (metres) at springs and neaps.
id: shearwater-shoal
name: Shearwater Shoal (invented)
kind: secondary
reference: storm-petrel-bank
position: { latitude: 36.7, longitude: -38.3 }
timezone: America/Noronha
datum: Chart Datum
differences:
  high_water: { springs: { time: 20, height: -0.25 }, neaps: { time: 12, height: -0.15 } }
  low_water: { springs: { time: 35, height: -0.05 }, neaps: { time: 25, height: -0.02 } }
provenance: "Invented for the tidewright starter folder: not a real place, not real differences"
number: "0002"
`,

  'pages/welcome.md': `---
# The settings of this page (delete a line to use its default):
title: Welcome                # the page's heading, its bookmark and its link in the website
order: 1                      # pages of one place run from the lowest number
place: front                  # front: before the tide tables; back: after them (default back)
in: both                      # both, site (the website only) or book (the books only)
# image: ads/sponsor.png      # instead of text: one picture filling the page (with alt: what it shows)
---
This almanac is published by the **Storm Petrel Bank Harbour Office** (invented). Replace this text
with your own: paragraphs, *emphasis*, lists, [links](https://example.invalid), simple tables and
pictures (\`![what it shows](pictures/quay.jpg)\`, the path relative to this file).

| Office hours | |
|---|---|
| Monday to Friday | 08:00 to 18:00 |
| Weekends | 09:00 to 12:00 |
`,

  'README.md': `# Your tide almanac

This folder is a tidewright almanac to start from. The two stations in it are **invented** and lie in
open ocean: replace them with your own before you publish anything.

## What is here

- \`tidewright.yaml\`: the title, publisher, page size, units and language of your almanac, each line
  explained.
- \`storm-petrel-bank.yaml\`: an example *reference port*: harmonic constants of the tide there.
- \`shearwater-shoal.yaml\`: an example *secondary port*: time and height differences from the reference
  port.
- \`pages/welcome.md\`: a page of your own in Markdown, printed in the books and shown on the website.
  Add more pages beside it; the settings at its top say where each goes.

## Put in your own stations

1. For each reference port write a file like \`storm-petrel-bank.yaml\` with its constants, from your
   hydrographic office or from a year of gauge readings: \`npx tidewright analyse gauge.csv --latitude …
   --longitude … --timezone … --output my-port.yaml\` writes one for you.
2. For each secondary port write a file like \`shearwater-shoal.yaml\`, or get its differences from a
   few weeks of readings: \`npx tidewright differences cove.csv --reference my-port.yaml --output cove.yaml\`.
3. Delete the two example files.
4. \`npx tidewright check --stations .\` lists every problem in every file, with the fix.

## Build

    npx tidewright build --stations . --out ../almanac-out

The output goes to a folder of its own, outside this one (here \`../almanac-out\`): the website to
\`site/\` in it (open \`site/index.html\`, or upload the folder), the PDF books to \`pdf/\` and the data
files (CSV, JSON, calendar) to \`data/\`. A build replaces that folder whole, and only when it succeeds.

## Caution

The predictions are astronomical only: wind, atmospheric pressure and river flow change real heights
and times. They do not replace the official tide tables or local notices; defer to the harbour
authority and licensed practice. Every page and book tidewright makes says so.
`,
};
