package org.viewgain.report;

/** The report's inline style sheet: screen and print, no fonts or images fetched from anywhere. */
final class Style {
    private Style() {
    }

    static final String CSS = """
            :root { --ink:#22303c; --muted:#5d6b78; --line:#d5dde3; --band:#f3f6f8; --teal:#1f7a72; --amber:#d98e04;
                    --warn:#9a3b12; --warnbg:#fdf3e7; --okbg:#eef7f2; }
            * { box-sizing: border-box; }
            html { font-size: 15px; }
            body { margin: 0; color: var(--ink); background: #fff; line-height: 1.5;
                   font-family: "DejaVu Sans", "Segoe UI", Helvetica, Arial, sans-serif; }
            header.top { background: var(--ink); color: #fff; padding: 1.4rem 2rem 1.1rem; }
            header.top h1 { margin: 0 0 .2rem; font-size: 1.55rem; font-weight: 600; letter-spacing: .01em; }
            header.top .meta { color: #c9d3db; font-size: .88rem; }
            .ruo { background: var(--amber); color: #1d1400; padding: .35rem 2rem; font-size: .88rem;
                   font-weight: 600; }
            .status-bad { background: #b5443a; color: #fff; padding: .5rem 2rem; font-weight: 600; }
            nav.toc { padding: .6rem 2rem; border-bottom: 1px solid var(--line); font-size: .9rem;
                      background: var(--band); }
            nav.toc a { color: var(--teal); margin-right: 1.2rem; text-decoration: none; }
            main { max-width: 1120px; margin: 0 auto; padding: .5rem 2rem 2rem; }
            section { padding-top: .6rem; border-bottom: 1px solid var(--line); padding-bottom: 1rem; }
            h2 { font-size: 1.3rem; margin: 1.1rem 0 .6rem; color: var(--teal); }
            h3 { font-size: 1.05rem; margin: 1.1rem 0 .45rem; }
            p.lead { font-size: 1.02rem; }
            p.verdict { font-size: 1.05rem; border-left: 4px solid #4a6fa5; padding: .3rem .7rem; background: #f3f6fb; }
            .small { font-size: .8rem; color: var(--muted); }
            p.absent { background: var(--band); border-left: 4px solid #9aa5af; padding: .45rem .8rem;
                       color: var(--muted); }
            ul.verdicts { padding-left: 1.1rem; }
            ul.verdicts li { margin: .35rem 0; }
            .badge { display: inline-block; background: var(--okbg); color: #1c5d3a; border: 1px solid #b9dcc8;
                     border-radius: 3px; padding: 0 .35rem; font-size: .75rem; white-space: nowrap; }
            table { border-collapse: collapse; margin: .4rem 0 .9rem; font-size: .86rem; }
            th, td { border-bottom: 1px solid var(--line); padding: .3rem .55rem; text-align: left;
                     vertical-align: top; }
            thead th { background: var(--band); border-bottom: 2px solid #b8c4cd; font-weight: 600; }
            td .num, td.num { font-variant-numeric: tabular-nums; }
            table.answer td:nth-child(n+3) { text-align: right; white-space: nowrap; }
            table.answer tr.pair th { background: #fff; font-weight: 600; padding-top: .7rem;
                                      border-bottom: 1px solid #b8c4cd; }
            table.keyvalue th { width: 11rem; background: none; font-weight: 600; }
            pre.spec { background: var(--band); border: 1px solid var(--line); padding: .8rem; font-size: .8rem;
                       overflow-x: auto; white-space: pre-wrap; }
            code { font-size: .78rem; word-break: break-all; }
            div.flow { display: flex; align-items: stretch; gap: .5rem; margin: .6rem 0 1rem; flex-wrap: wrap; }
            div.flow .box { border: 1px solid var(--line); border-top: 4px solid var(--teal); background: #fff;
                         padding: .5rem .8rem; max-width: 20rem; }
            div.flow .arrow { align-self: center; font-size: 1.4rem; color: var(--muted); }
            ul.checks li.ok { color: #1c5d3a; }
            ul.checks li.warn { color: var(--warn); background: var(--warnbg); padding: .15rem .4rem; margin: .2rem 0;
                                list-style: square; }
            ul.cautions li { margin: .4rem 0; }
            p.warn { color: var(--warn); background: var(--warnbg); padding: .3rem .5rem; }
            .grid { display: flex; flex-wrap: wrap; gap: 1rem; }
            figure { margin: .3rem 0 .8rem; max-width: 100%; }
            figure img { max-width: 100%; height: auto; border: 1px solid var(--line); }
            figcaption { font-size: .8rem; color: var(--muted); max-width: 480px; }
            .grid figure { flex: 0 1 auto; }
            details { margin: .4rem 0 .8rem; }
            summary { cursor: pointer; color: var(--teal); }
            footer { max-width: 1120px; margin: 0 auto; padding: 1rem 2rem 2rem; font-size: .8rem;
                     color: var(--muted); }
            @media (max-width: 900px) {
              main, footer { padding: .5rem .8rem 1.5rem; }
              table { display: block; max-width: 100%; overflow-x: auto; }
              table.answer td:nth-child(n+3) { white-space: normal; }
              th, td { padding: .25rem .35rem; }
            }
            @media print {
              @page { margin: 14mm 12mm; }
              html { font-size: 10.5pt; }
              nav.toc { display: none; }
              header.top { background: none; color: #000; border-bottom: 2px solid #000; padding: 0 0 .4rem; }
              header.top .meta { color: #333; }
              .ruo { background: none; border: 1px solid #000; color: #000; }
              main, footer { max-width: none; padding: 0; }
              section { break-inside: auto; }
              h2, h3 { break-after: avoid; }
              figure, table.answer, div.flow, ul.verdicts li { break-inside: avoid; }
              figure img { max-width: 100%; }
              table { font-size: 8.5pt; }
              table.answer td:nth-child(n+3) { white-space: normal; }
              thead { display: table-header-group; }
              tr { break-inside: avoid; }
              details::details-content { content-visibility: visible; display: contents; }
              a { color: inherit; text-decoration: none; }
            }
            """;
}
