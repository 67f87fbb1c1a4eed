// The page's one inline style sheet: system fonts only, light colours, printable, nothing fetched.

export const PAGE_STYLE = `
:root { color-scheme: light; --ink: #1d2733; --muted: #5b6673; --line: #d5dbe2; --soft: #f3f5f8; --accent: #0b6e99; --bad: #b3261e; --good: #2f7d5b; }
* { box-sizing: border-box; }
body { margin: 0; font: 14px/1.45 system-ui, -apple-system, "Segoe UI", sans-serif; color: var(--ink); background: #fff; }
header, main, footer { max-width: 1080px; margin: 0 auto; padding: 0 20px; }
header { padding-top: 22px; border-bottom: 3px solid var(--accent); padding-bottom: 10px; }
h1 { font-size: 22px; margin: 0 0 4px; }
h2 { font-size: 17px; margin: 30px 0 10px; padding-bottom: 4px; border-bottom: 1px solid var(--line); }
.source { margin: 0; color: var(--muted); }
code, .mono, td.mono { font-family: ui-monospace, "SFMono-Regular", Menlo, Consolas, monospace; font-size: 12.5px; }
.figures { display: grid; grid-template-columns: repeat(auto-fill, minmax(150px, 1fr)); gap: 10px; margin: 0; }
.figure { background: var(--soft); border: 1px solid var(--line); border-radius: 6px; padding: 8px 12px; }
.figure dt { font-size: 12px; color: var(--muted); }
.figure dd { margin: 2px 0 0; font-size: 19px; font-weight: 600; font-variant-numeric: tabular-nums; overflow-wrap: anywhere; }
.figure.key { border-color: var(--accent); }
.figure.over dd { color: var(--bad); }
.figure.within dd { color: var(--good); }
.figure small { display: block; font-size: 12px; font-weight: 400; color: var(--muted); }
.note { background: #fff6e0; border-left: 4px solid #d69e1a; padding: 6px 10px; margin: 12px 0; }
.note.over { background: #fdecea; border-left-color: var(--bad); }
.muted { color: var(--muted); }
.scroll { overflow-x: auto; }
table { border-collapse: collapse; width: 100%; font-variant-numeric: tabular-nums; }
caption { caption-side: top; text-align: left; padding: 4px 0 6px; font-size: 13px; }
figure + .scroll { margin-top: 14px; }
th, td { padding: 5px 8px; border-bottom: 1px solid var(--line); text-align: left; vertical-align: top; }
td.n, th.n { text-align: right; }
thead th { background: var(--soft); font-weight: 600; white-space: nowrap; }
th button { all: unset; cursor: pointer; }
th button:focus-visible { outline: 2px solid var(--accent); outline-offset: 2px; }
th[aria-sort] button::after { content: " \\2195"; color: var(--muted); }
th[aria-sort="ascending"] button::after { content: " \\25B2"; color: var(--accent); }
th[aria-sort="descending"] button::after { content: " \\25BC"; color: var(--accent); }
tbody tr:hover { background: #f7fafc; }
tfoot td { font-weight: 600; }
svg { max-width: 100%; height: auto; display: block; }
figure { margin: 0; }
figcaption { color: var(--muted); font-size: 13px; margin-top: 4px; }
details { margin-top: 10px; }
summary { cursor: pointer; color: var(--accent); }
footer { margin-top: 36px; padding-top: 10px; padding-bottom: 24px; border-top: 1px solid var(--line); color: var(--muted); font-size: 12.5px; }
@media print { th button::after { content: none !important; } header { border-bottom-color: #000; } }
`;
