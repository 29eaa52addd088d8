/** The stylesheet of viewer.html: screen and print (print: every view stacked, controls hidden). */
export const VIEWER_CSS = `
:root{--ink:#1a1a1a;--muted:#5a5a5a;--rule:#c8c8c8;--pass:#1b6e2e;--fail:#b00020;--none:#6a5a00}
*{box-sizing:border-box}
body{margin:0;font:14px/1.4 system-ui,-apple-system,"Segoe UI",Roboto,"DejaVu Sans",sans-serif;color:var(--ink);background:#f6f6f4}
header{padding:12px 20px;background:#fff;border-bottom:1px solid var(--rule)}
h1{font-size:20px;margin:0 0 4px}h2{font-size:17px;margin:0 0 8px}h3{font-size:14px;margin:12px 0 6px}
.meta,.hint,.note,figcaption{color:var(--muted);font-size:12.5px}
.panel{background:#fff;margin:12px 20px;padding:12px 16px;border:1px solid var(--rule);border-radius:4px}
table{border-collapse:collapse;font-size:13px}
th,td{padding:3px 8px;border-bottom:1px solid #e4e4e4;text-align:left;vertical-align:top}
td.num{text-align:right;font-variant-numeric:tabular-nums}
table.units{width:100%}
table.units tbody tr{cursor:pointer}
table.units tbody tr:hover{background:#f0f3fa}
table.units tr.chosen{background:#e3eaf8;outline:2px solid #1f4e9a;outline-offset:-2px}
tr:focus{outline:2px solid #1f4e9a;outline-offset:-2px}
button.sort{border:0;background:none;font:inherit;font-weight:600;cursor:pointer;padding:0}
button.link{border:0;background:none;color:#1f4e9a;text-decoration:underline;cursor:pointer;font:inherit;padding:0}
tr.pass td.c-verdict,tr.pass td:nth-child(5){color:var(--pass);font-weight:600}
tr.fail td.c-verdict,tr.fail td:nth-child(5){color:var(--fail);font-weight:600}
tr.none td.c-verdict{color:var(--none)}
.verdict{font-weight:600;padding:4px 8px;border-left:5px solid var(--none)}
.verdict.pass{border-color:var(--pass)}.verdict.fail{border-color:var(--fail);color:var(--fail)}
.views{display:grid;grid-template-columns:minmax(360px,3fr) minmax(260px,2fr) minmax(200px,1fr);gap:12px;align-items:start}
figure{margin:0}
canvas.map{width:100%;height:auto;aspect-ratio:2/1;display:block;cursor:crosshair}
canvas.sphere{width:100%;aspect-ratio:1/1;display:block;border:1px solid #eee;cursor:grab}
canvas.plot{width:100%;height:auto;aspect-ratio:56/30;display:block;border:1px solid #eee}
canvas:focus{outline:2px solid #1f4e9a}
.colorbar{display:flex;gap:6px;align-items:center;flex-wrap:wrap;font-size:12px;margin:4px 0}
.colorbar .bar{flex:1;min-width:120px;height:12px;border:1px solid #999}
.swatch{display:inline-block;width:11px;height:11px;border:1px solid #777;margin-right:4px;vertical-align:-1px}
.key{margin-right:6px;white-space:nowrap}
.readout{display:grid;grid-template-columns:auto 1fr;gap:2px 8px;margin:0;font-size:13px}
.readout dt{color:var(--muted)}.readout dd{margin:0;font-variant-numeric:tabular-nums}
.cols{display:grid;grid-template-columns:1fr 1fr;gap:16px}
.beams{max-height:420px;overflow:auto}
tr.fail td{color:var(--fail)}
.plotout{font-size:12.5px;min-height:1.4em;margin:2px 0}
footer.cautions{margin:12px 20px 24px;padding:8px 12px;font-size:12px;color:var(--muted);border-top:1px solid var(--rule)}
@media (max-width:1000px){.views,.cols{grid-template-columns:1fr}}
@media print{
  body{background:#fff;font-size:10.5pt}
  .noprint,.controls,button.sort::after{display:none!important}
  .panel{border:0;margin:0 0 8px;padding:0}
  .views,.cols{grid-template-columns:1fr 1fr}
  .readoutbox{display:none}
  .beams{max-height:none;overflow:visible}
  figure,table{break-inside:avoid}
  #unit{break-before:page}
  canvas{max-width:100%}
  footer.cautions{position:static;color:#000}
}
`;
