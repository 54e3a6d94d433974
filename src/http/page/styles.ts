/**
 * The page's stylesheet, served as /assets/page.css (same origin, so a CSP of style-src 'self'
 * suffices). Colours: warm paper, ink, a deep teal for cells and an ember accent for the Durfee
 * square and the laws; text contrast is at least 4.5:1 in both schemes (WCAG 2.2, 1.4.3).
 * Drawings carry presentation attributes; the classes below recolour them for the dark scheme.
 */
export const PAGE_CSS = `
:root {
  --paper: #f5f0e6; --card: #fffdf8; --ink: #1f1d2b; --muted: #55525f; --line: #ddd4c3;
  --teal: #17676c; --teal-soft: #e1efee; --ember: #b5461b; --ember-soft: #f7e4da;
  --code: #24212f; --code-ink: #f3efe6; --ok: #1d6b3a; --bad: #a3261b;
  --radius: 14px; --shadow: 0 1px 0 rgba(31,29,43,.06), 0 8px 24px -12px rgba(31,29,43,.18);
  color-scheme: light dark;
}
@media (prefers-color-scheme: dark) {
  :root {
    --paper: #15141b; --card: #1e1d27; --ink: #eeeae1; --muted: #b4afbf; --line: #353345;
    --teal: #5cc2bd; --teal-soft: #1d3434; --ember: #f08c5e; --ember-soft: #3a2419;
    --code: #0f0e14; --code-ink: #eeeae1; --ok: #6fd08f; --bad: #ff8a7a;
    --shadow: 0 1px 0 rgba(0,0,0,.3), 0 8px 24px -12px rgba(0,0,0,.6);
  }
}
*, *::before, *::after { box-sizing: border-box; }
html { -webkit-text-size-adjust: 100%; }
body {
  margin: 0; background: var(--paper); color: var(--ink);
  font: 16px/1.55 system-ui, -apple-system, "Segoe UI", Roboto, "Noto Sans", sans-serif;
}
a { color: var(--teal); text-underline-offset: 2px; }
a:hover { color: var(--ember); }
:focus-visible { outline: 3px solid var(--ember); outline-offset: 2px; border-radius: 4px; }
.skip { position: absolute; left: -999px; top: 0; background: var(--card); padding: .5rem 1rem; z-index: 10; }
.skip:focus { left: 1rem; top: 1rem; }
.masthead { border-bottom: 1px solid var(--line); background: var(--card); }
.masthead-inner, .layout { max-width: 76rem; margin: 0 auto; padding: 0 1.25rem; }
.masthead-inner { display: flex; align-items: center; gap: .9rem; padding-top: 1rem; padding-bottom: 1rem; flex-wrap: wrap; }
.brand { display: flex; align-items: center; gap: .6rem; text-decoration: none; color: var(--ink); }
.brand svg { width: 34px; height: 34px; }
.brand .cell { fill: var(--teal); } .brand .durfee { fill: var(--ember); }
.wordmark { font: 700 1.45rem/1 ui-serif, Georgia, "Times New Roman", serif; letter-spacing: -.01em; }
.tagline { margin: 0; color: var(--muted); font-size: .95rem; }
.masthead nav { margin-left: auto; display: flex; gap: 1rem; font-size: .95rem; }
.layout { display: grid; grid-template-columns: minmax(0, 1fr); gap: 1.5rem; padding-top: 1.5rem; padding-bottom: 3rem; }
@media (min-width: 60rem) {
  .layout { grid-template-columns: 21rem minmax(0, 1fr); align-items: start; }
  .controls { position: sticky; top: 1rem; }
}
.card { background: var(--card); border: 1px solid var(--line); border-radius: var(--radius); box-shadow: var(--shadow); padding: 1.1rem 1.2rem; }
h1, h2, h3 { font-family: ui-serif, Georgia, "Times New Roman", serif; line-height: 1.2; margin: 0 0 .6rem; }
h1 { font-size: 1.35rem; } h2 { font-size: 1.3rem; } h3 { font-size: 1.05rem; }
fieldset { border: 0; padding: 0; margin: 0 0 1rem; min-width: 0; }
legend { font-weight: 650; padding: 0; margin-bottom: .5rem; }
.field { display: grid; gap: .25rem; margin-bottom: .75rem; }
.row { display: grid; grid-template-columns: 1fr 1fr; gap: .75rem; }
label { font-weight: 550; font-size: .95rem; }
.hint { color: var(--muted); font-size: .85rem; margin: 0; }
input[type=text], input[type=number], select {
  font: inherit; color: var(--ink); background: var(--paper); width: 100%;
  border: 1.5px solid var(--line); border-radius: 10px; padding: .5rem .65rem; min-height: 2.75rem;
}
input:hover, select:hover { border-color: var(--muted); }
input[aria-invalid=true] { border-color: var(--bad); }
.error { color: var(--bad); font-size: .88rem; margin: 0; font-weight: 550; }
.check { display: flex; gap: .55rem; align-items: center; margin-bottom: .75rem; min-height: 2.75rem; }
.check input { width: 1.25rem; height: 1.25rem; accent-color: var(--teal); }
details.constraints { border-top: 1px dashed var(--line); border-bottom: 1px dashed var(--line); padding: .6rem 0; margin-bottom: 1rem; }
details.constraints summary { cursor: pointer; font-weight: 650; min-height: 2.25rem; display: flex; align-items: center; gap: .5rem; list-style: none; }
details.constraints summary::-webkit-details-marker { display: none; }
details.constraints summary::before { content: ""; width: .55rem; height: .55rem; border-right: 2px solid var(--teal); border-bottom: 2px solid var(--teal); transform: rotate(-45deg); margin: 0 .2rem 0 .1rem; }
details.constraints[open] summary::before { transform: rotate(45deg); }
details.constraints summary .hint { font-weight: 400; margin-left: auto; }
details.constraints[open] summary { margin-bottom: .6rem; }
button, .button {
  font: inherit; font-weight: 650; cursor: pointer; border-radius: 10px; min-height: 2.75rem;
  border: 1.5px solid var(--teal); background: var(--teal); color: var(--card); padding: .5rem 1.1rem;
}
button:hover { background: var(--ink); border-color: var(--ink); color: var(--card); }
button.quiet { background: transparent; color: var(--teal); min-height: 2.25rem; padding: .25rem .75rem; font-size: .9rem; }
button.quiet:hover { background: var(--teal-soft); color: var(--ink); }
.submit { width: 100%; font-size: 1.05rem; }
.results { display: grid; grid-template-columns: minmax(0, 1fr); gap: 1.5rem; min-width: 0; }
.summary { display: flex; flex-wrap: wrap; gap: .4rem .6rem; align-items: baseline; margin: 0 0 1rem; color: var(--muted); }
.pill { display: inline-block; background: var(--teal-soft); color: var(--ink); border-radius: 999px; padding: .1rem .65rem; font-size: .88rem; }
.pill code { font-size: .85rem; }
.diagrams { list-style: none; margin: 0; padding: 0; display: grid; gap: .9rem; grid-template-columns: repeat(auto-fill, minmax(min(11rem, 100%), 1fr)); }
.diagrams li { min-width: 0; }
.diagrams figure { margin: 0; background: var(--paper); border: 1px solid var(--line); border-radius: 12px; padding: .7rem; height: 100%; display: flex; flex-direction: column; gap: .5rem; }
.diagrams a.drawing { display: block; min-height: 3rem; border-radius: 8px; }
.diagrams svg { display: block; max-width: 100%; height: auto; }
.ferrers .cell { fill: var(--teal); } .ferrers .durfee { fill: var(--ember); } .ferrers .part-size { fill: var(--muted); }
figcaption { font-size: .85rem; color: var(--muted); overflow-wrap: anywhere; }
figcaption strong { color: var(--ink); font-weight: 650; }
figcaption .rank { display: block; font-variant-numeric: tabular-nums; }
.members { grid-template-columns: repeat(auto-fill, minmax(min(8rem, 100%), 1fr)); }
.pager { display: flex; justify-content: space-between; gap: 1rem; margin-top: .9rem; }
.pager a[rel=next] { margin-left: auto; }
.too-large { color: var(--muted); font-size: .9rem; }
.note { color: var(--muted); font-size: .9rem; margin: .75rem 0 0; }
.snippets { display: grid; grid-template-columns: minmax(0, 1fr); gap: .9rem; }
.snippet-head { display: flex; justify-content: space-between; align-items: center; gap: .5rem; margin-bottom: .35rem; }
.snippet-head h3 { margin: 0; font-size: 1rem; font-family: inherit; }
pre {
  margin: 0; background: var(--code); color: var(--code-ink); border-radius: 10px; padding: .8rem .95rem;
  overflow: auto; font: .86rem/1.5 ui-monospace, "SFMono-Regular", Menlo, Consolas, monospace; max-height: 26rem;
}
pre:focus-visible { outline-offset: 3px; }
.status { min-height: 1.2rem; font-size: .85rem; color: var(--ok); margin: .25rem 0 0; }
.plots { display: grid; grid-template-columns: minmax(0, 1fr); gap: 1rem; }
@media (min-width: 90rem) { .plots { grid-template-columns: repeat(2, minmax(0, 1fr)); } }
.plots figure { margin: 0; background: var(--paper); border: 1px solid var(--line); border-radius: 12px; padding: .5rem; }
.plots svg { width: 100%; height: auto; display: block; }
.plot .label { fill: var(--muted); } .plot .grid { stroke: var(--line); } .plot .axis { stroke: var(--muted); }
.plot .bar, .plot .mean-dot { fill: var(--teal); } .plot .law { stroke: var(--ember); } .plot .law-dot { fill: var(--ember); }
.plot .legend { fill: var(--card); stroke: var(--line); }
.verdict { display: flex; gap: .6rem; align-items: flex-start; border-radius: 12px; padding: .75rem .9rem; margin-bottom: 1rem; border: 1.5px solid; }
.verdict.pass { border-color: var(--ok); } .verdict.fail { border-color: var(--bad); }
.verdict .mark { font-weight: 800; font-size: 1.1rem; line-height: 1.4; }
.verdict.pass .mark { color: var(--ok); } .verdict.fail .mark { color: var(--bad); }
.verdict p { margin: 0; }
.stats { width: 100%; border-collapse: collapse; font-size: .92rem; margin-top: .75rem; }
.stats th, .stats td { text-align: left; padding: .35rem .5rem; border-bottom: 1px solid var(--line); vertical-align: top; }
.stats th { color: var(--muted); font-weight: 600; width: 40%; }
.problem { border-left: 4px solid var(--bad); padding: .6rem .9rem; background: var(--ember-soft); border-radius: 0 10px 10px 0; }
.problem p { margin: 0; }
.error-summary { margin-bottom: 1rem; }
.error-summary ul { margin: .3rem 0 0; padding-left: 1.2rem; }
footer { color: var(--muted); font-size: .85rem; max-width: 76rem; margin: 0 auto; padding: 0 1.25rem 2rem; }
@media (max-width: 30rem) {
  .masthead nav { margin-left: 0; }
  .card { padding: 1rem; }
  .diagrams { grid-template-columns: repeat(2, minmax(0, 1fr)); }
}
@media (prefers-reduced-motion: no-preference) { button { transition: background-color .15s, color .15s; } }
`;
