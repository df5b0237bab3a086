namespace RunWatch.Reports.Html;

/// <summary>The page's style sheet: screen and print (A4, sections kept whole where possible).</summary>
internal static class HtmlStyles
{
    public const string Css = """
        body { font-family: "DejaVu Sans", "Helvetica", "Arial", sans-serif; font-size: 10.5pt; color: #111; margin: 2em auto; max-width: 60em; padding: 0 1em; }
        h1 { font-size: 18pt; margin: 0 0 .3em 0; }
        h1 .id { font-family: "DejaVu Sans Mono", monospace; }
        h2 { font-size: 13pt; border-bottom: 1px solid #999; margin-top: 1.4em; }
        h3 { font-size: 11pt; margin-bottom: .3em; }
        .label { display: inline-block; background: #fff3cd; border: 1px solid #c9a227; padding: .1em .6em; margin: 0 0 .5em 0; }
        table { border-collapse: collapse; margin: .4em 0 .8em 0; }
        th, td { border: 1px solid #bbb; padding: .15em .5em; text-align: left; vertical-align: top; }
        thead th { background: #eee; }
        table.kv th { background: #f5f5f5; font-weight: normal; width: 14em; }
        td.num { text-align: right; font-variant-numeric: tabular-nums; }
        .verdict { border: 2px solid #555; padding: .2em 1em .6em 1em; margin-top: 1em; }
        .verdict h2 { border: none; }
        .verdict.pass { border-color: #2e7d32; }
        .verdict.warn { border-color: #b26a00; }
        .verdict.fail { border-color: #b00020; }
        .outcome { letter-spacing: .05em; }
        td.pass, .tag.pass { color: #2e7d32; font-weight: bold; }
        td.warn, .tag.warn { color: #b26a00; font-weight: bold; }
        td.fail, .tag.fail { color: #b00020; font-weight: bold; }
        figure { margin: .5em 0; }
        figure.chart svg { max-width: 100%; height: auto; }
        .fields { display: flex; flex-wrap: wrap; gap: 1em; }
        figure.field { width: 15em; }
        figure.field img { width: 100%; border: 1px solid #999; }
        figcaption { font-size: 9pt; color: #333; }
        .missing { color: #b00020; }
        .caution { margin-top: 2em; border-top: 2px solid #555; font-size: 9pt; }
        @page { size: A4; margin: 15mm; }
        @media print {
          body { margin: 0; max-width: none; font-size: 9.5pt; }
          section, figure, table.kv, .verdict { break-inside: avoid; }
          section.wires { break-inside: auto; }
          thead { display: table-header-group; }
          tr { break-inside: avoid; }
          h2 { break-after: avoid; }
        }

        """;
}
