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
:root{--ink:#1b2430;--muted:#5a6472;--rule:#d9dcd4;--paper:#f7f4ec;--slate:#16212f;--slate-line:#2b3c52;--accent:#0072b2;--ok:#1f7a4d;--bad:#b3261e}
*{box-sizing:border-box}
body{font-family:'Lato',system-ui,sans-serif;color:var(--ink);margin:0 auto;max-width:60rem;padding:1.5rem;line-height:1.45;font-size:11pt}
h1{font-size:1.45rem;margin:.5rem 0 0;line-height:1.25}h1 .ref{font-variant-numeric:tabular-nums;color:#a9b8cc;font-weight:400;margin-right:.35rem}
.brand{background:var(--slate);color:#fff;padding:.9rem 1.1rem 1rem;border-radius:6px;border-bottom:3px solid #e69f00}
.brand-line{display:flex;align-items:center;gap:.5rem;font-size:.85rem}.brand .mark{display:block}
.wordmark{font-weight:700;font-size:1.05rem;letter-spacing:.02em}.wordmark span{color:#a9b8cc}
.brand .kind{margin-left:auto;text-transform:uppercase;letter-spacing:.12em;font-size:.72rem;color:#a9b8cc}
.path{list-style:none;display:grid;grid-template-columns:repeat(6,1fr);margin:.6rem 0 .3rem;padding:0}
.station{position:relative;display:flex;flex-direction:column;align-items:center;text-align:center;font-size:.78rem;color:var(--muted)}
.station b{color:var(--ink);margin-top:.25rem}.station.todo b,.station.skipped b{color:var(--muted);font-weight:400}
.station+.station::before{content:'';position:absolute;top:.45rem;right:50%;width:100%;border-top:2px dashed var(--rule)}
.station.done+.station.done::before,.station.done+.station.now::before{border-top:2px solid var(--slate-line)}
.station .dot{position:relative;z-index:1;width:.9rem;height:.9rem;border-radius:50%;border:2px solid var(--rule);background:#fff}
.station.done .dot{background:var(--slate-line);border-color:var(--slate-line)}
.station.now .dot{border-color:var(--accent);box-shadow:inset 0 0 0 2px #fff,inset 0 0 0 5px var(--accent)}
.station.skipped .dot{border-style:dashed}
.standing{margin:.2rem 0 .6rem;font-size:.92rem}
.severity{display:inline-flex;align-items:center;gap:.35rem}.severity-mark{vertical-align:middle}
time{font-variant-numeric:tabular-nums}h2{font-size:1.2rem;margin:1.6rem 0 .5rem;border-bottom:1px solid var(--rule);padding-bottom:.2rem}
h3{font-size:1rem;margin:1rem 0 .3rem}
.caution{border:2px solid #e69f00;background:#fff8e6;padding:.6rem .8rem;margin:1rem 0;font-weight:700}
table{border-collapse:collapse;width:100%;margin:.4rem 0;font-size:.9rem}th,td{text-align:left;padding:.25rem .4rem;border-bottom:1px solid var(--rule);vertical-align:top}
th{font-weight:700;color:var(--muted)}
img.figure{display:block;max-width:100%;max-height:320px;margin-top:.4rem;border:1px solid #d9dcd4}
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
@media print{body{max-width:none;padding:0;font-size:10pt}.brand{background:none;color:var(--ink);border:1.5px solid var(--ink);border-bottom-width:3px}.brand .kind,h1 .ref,.wordmark span{color:var(--muted)}h2{break-after:avoid}a{color:inherit;text-decoration:none}}`;
  return cached;
}
