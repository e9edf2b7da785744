import fs from 'node:fs';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

function fontFace(weight: 400 | 700): string {
  const file = require.resolve(`@fontsource/lato/files/lato-latin-${weight}-normal.woff2`);
  const base64 = fs.readFileSync(file).toString('base64');
  return `@font-face{font-family:'Lato';font-style:normal;font-weight:${weight};font-display:block;src:url(data:font/woff2;base64,${base64}) format('woff2');}`;
}

let cached: string | undefined;

/**
 * The report's whole stylesheet, fonts included as data URLs, so the file opens offline years
 * later. `@page { size: auto }` lets the printer's paper (A4 or Letter) decide.
 */
export function reportStyles(): string {
  cached ??= `${fontFace(400)}${fontFace(700)}
:root{--ink:#1f2933;--muted:#52606d;--rule:#cbd2d9;--accent:#0072b2;--ok:#2f7d32;--bad:#b42318}
*{box-sizing:border-box}
body{font-family:'Lato',system-ui,sans-serif;color:var(--ink);margin:0 auto;max-width:60rem;padding:1.5rem;line-height:1.45;font-size:11pt}
h1{font-size:1.6rem;margin:0 0 .25rem}h2{font-size:1.2rem;margin:1.6rem 0 .5rem;border-bottom:1px solid var(--rule);padding-bottom:.2rem}
h3{font-size:1rem;margin:1rem 0 .3rem}
.caution{border:2px solid #e69f00;background:#fff8e6;padding:.6rem .8rem;margin:1rem 0;font-weight:700}
table{border-collapse:collapse;width:100%;margin:.4rem 0;font-size:.9rem}th,td{text-align:left;padding:.25rem .4rem;border-bottom:1px solid var(--rule);vertical-align:top}
th{font-weight:700;color:var(--muted)}
.hash{font-family:ui-monospace,Menlo,Consolas,monospace;font-size:.78rem;word-break:break-all}
.unit{color:var(--muted);font-weight:400}
.ok{color:var(--ok);font-weight:700}.bad{color:var(--bad);font-weight:700}
figure{margin:.8rem 0;break-inside:avoid;page-break-inside:avoid}figcaption{font-size:.85rem;color:var(--muted)}
svg{max-width:100%;height:auto}
.maps{display:flex;flex-wrap:wrap;gap:.8rem}.maps figure{flex:1 1 16rem;max-width:20rem}
.legend span{display:inline-block;margin-right:1rem;font-size:.85rem}
.swatch{display:inline-block;width:.9rem;height:.5rem;margin-right:.3rem;vertical-align:middle}
section{break-inside:auto}
@page{size:auto;margin:16mm 14mm}
@media print{body{max-width:none;padding:0;font-size:10pt}h2{break-after:avoid}a{color:inherit;text-decoration:none}}`;
  return cached;
}
