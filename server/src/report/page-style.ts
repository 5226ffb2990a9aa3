/**
 * The stylesheet shared by the HTML report and the editor views: a light page, quiet tables with
 * the worst value of a column marked, and a caution box. Our own look; no external fonts or
 * resources, so a page renders the same offline and inside a locked-down webview.
 */
export const PAGE_CSS = `
.rl-page{font:14px/1.45 system-ui,-apple-system,"Segoe UI",sans-serif;color:#2a2824;background:#f6f4ef;margin:0;padding:20px 28px}
.rl-page h1{font-size:22px;margin:0 0 4px}
.rl-page h2{font-size:18px;margin:28px 0 8px;border-bottom:2px solid #d8d2c4;padding-bottom:4px}
.rl-page h3{font-size:15px;margin:20px 0 6px;color:#3d3a33}
.rl-sub{color:#6a655b;margin:0 0 12px}
.rl-card{background:#fffdf9;border:1px solid #e2dccf;border-radius:8px;padding:14px 16px;margin:12px 0}
.rl-table{border-collapse:collapse;margin:8px 0;font-size:13px;background:#fffdf9}
.rl-table th,.rl-table td{border:1px solid #e2dccf;padding:4px 8px;text-align:right;vertical-align:top}
.rl-table th[scope=row],.rl-table td:first-child{text-align:left}
.rl-table thead th{background:#efeadf;text-align:center}
.rl-compare-table td:nth-child(2){text-align:left}
.rl-table td.rl-worst{background:#fde9d9;font-weight:600}
.rl-corner{display:block;font-size:11px;color:#7a756b;font-weight:400}
.rl-na{color:#7a756b;font-style:italic;text-align:left}
.rl-assumptions{font-size:12.5px;color:#4d493f;margin:6px 0 0 18px;padding:0}
.rl-caution{border-left:5px solid #b8412c;background:#fbeee9;padding:10px 14px;border-radius:4px;margin:12px 0}
.rl-netlist{font:12.5px/1.5 ui-monospace,"DejaVu Sans Mono",monospace;background:#fffdf9;border:1px solid #e2dccf;border-radius:6px;padding:10px 12px;overflow-x:auto;white-space:pre}
.rl-note{color:#1f6f78}
.rl-sev-error{color:#a4281b;font-weight:600}
.rl-sev-warning{color:#9a5b00;font-weight:600}
.rl-sev-info,.rl-sev-hint{color:#3d5f8a}
.rl-findings{margin:6px 0 0 18px;padding:0}
.rl-chart,.rl-compare{max-width:100%;height:auto;display:block;margin:8px 0}
.rl-review td{text-align:left;font-size:12px}
.rl-review .rl-verdict{font-weight:600}
.rl-review-error .rl-verdict,.rl-review-runaway .rl-verdict{color:#a4281b}
.rl-review-warning .rl-verdict{color:#9a5b00}
@page{margin:14mm}
@media print{
.rl-page{background:#fff;padding:0;font-size:11pt}
.rl-card,.rl-table,.rl-caution{-webkit-print-color-adjust:exact;print-color-adjust:exact}
.rl-file + .rl-file,.rl-card,.rl-review-record{break-before:page}
.rl-table,.rl-chart,.rl-compare,figure,svg{break-inside:avoid}
.rl-table.rl-review{break-inside:auto}
.rl-review tr{break-inside:avoid}
.rl-review thead{display:table-header-group}
.rl-table{font-size:9pt}
.rl-netlist{white-space:pre-wrap;overflow:visible}
h2,h3{break-after:avoid}
}
`;
