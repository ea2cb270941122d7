// The report's only styling: readable on a phone, prints cleanly, no external resources.

export const REPORT_CSS = `
:root { color-scheme: light; }
body { font-family: system-ui, sans-serif; line-height: 1.45; color: #1b1f24; background: #fff;
  max-width: 52rem; margin: 0 auto; padding: 1rem; }
h1 { font-size: 1.5rem; margin-bottom: 0.25rem; }
h2 { font-size: 1.15rem; margin-top: 2rem; border-bottom: 1px solid #c9d1d9; padding-bottom: 0.2rem; }
.subtitle { margin-top: 0; color: #444c56; }
.caution { border: 2px solid #9a3412; background: #fff7ed; padding: 0.6rem 0.9rem; border-radius: 4px; }
.caution strong { color: #9a3412; }
.caution h2 { margin-top: 0.3rem; }
dl.facts { display: grid; grid-template-columns: max-content 1fr; gap: 0.2rem 1rem; }
dl.facts dt { font-weight: 600; }
dl.facts dd { margin: 0; overflow-wrap: anywhere; }
@media (max-width: 36rem) { dl.facts { grid-template-columns: 1fr; } dl.facts dd { margin-bottom: 0.4rem; } }
div.table-scroll { overflow-x: auto; }
table { border-collapse: collapse; width: 100%; font-variant-numeric: tabular-nums; }
caption { text-align: left; font-weight: 600; padding-bottom: 0.3rem; }
th, td { border-bottom: 1px solid #d0d7de; padding: 0.25rem 0.5rem; text-align: right; }
th:first-child, td:first-child { text-align: left; }
thead th { background: #f3f5f7; }
.weak { color: #6e7781; }
figure.chart { margin: 1rem 0; }
figure.chart svg { width: 100%; height: auto; display: block; }
figcaption { font-size: 0.9rem; color: #444c56; }
.plot-area { fill: #fbfcfd; stroke: #8c959f; stroke-width: 1; }
.grid { stroke: #e3e7eb; stroke-width: 1; }
.zero { stroke: #57606a; stroke-width: 1; }
.tick, .legend { font-size: 11px; fill: #24292f; }
path.observed, line.observed { fill: none; stroke: #0b5cad; stroke-width: 1.2; }
path.fitted, line.fitted { fill: none; stroke: #c2410c; stroke-width: 1.2; stroke-dasharray: 4 2; }
path.residual, line.residual { fill: none; stroke: #4d7c0f; stroke-width: 1; }
footer { margin-top: 2.5rem; font-size: 0.85rem; color: #444c56; border-top: 1px solid #c9d1d9; padding-top: 0.5rem; }
@media print { body { max-width: none; } h2 { break-after: avoid; } figure, table { break-inside: avoid; } }
`;
