namespace QaService.Core.Reporting.Html;

/// <summary>
/// The house look, inline so a saved page needs nothing else: warm paper, slate ink, a rust rule; system fonts;
/// figures in tabular digits. Text colours keep a contrast ratio of at least 4.5:1 on their backgrounds
/// (WCAG 2.1 success criterion 1.4.3). The print rules fit a 180 mm column, which suits A4 and US Letter alike.
/// </summary>
public static class PageStyle
{
    public const string Css = """
        :root{--paper:#fbf9f4;--ink:#1f2a30;--muted:#4d5a60;--rule:#b8482a;--line:#d8d2c4;--panel:#f2eee4;
          --pass:#1c5e36;--pass-bg:#e3f0e6;--fail:#9a1f16;--fail-bg:#f8e4e0;--open:#6a4a00;--open-bg:#f7ecd0;
          --dot:#24557a;--c50:#5d6b1f;--c95:#b8482a;--ell:#6b3f8f;--model:#24557a}
        *{box-sizing:border-box}
        html{background:var(--paper);color:var(--ink)}
        body{font:15px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,"Noto Sans",sans-serif;max-width:62rem;margin:0 auto;padding:0 1.25rem 3rem}
        a{color:#1d4f73}
        code{font-family:ui-monospace,"SFMono-Regular",Menlo,Consolas,monospace;font-size:.92em}
        .masthead{display:flex;gap:1rem;align-items:center;border-bottom:3px solid var(--rule);padding:1.2rem 0 .8rem;margin-bottom:.4rem}
        .masthead svg{width:44px;height:44px;flex:none}
        .masthead .brand{font-size:.8rem;letter-spacing:.14em;text-transform:uppercase;color:var(--muted);margin:0}
        .masthead h1{font-size:1.45rem;line-height:1.25;margin:.1rem 0 0}
        .meta{color:var(--muted);font-size:.85rem;margin:.2rem 0 1rem}
        h2{font-size:1.15rem;margin:2.2rem 0 .7rem;padding-bottom:.25rem;border-bottom:1px solid var(--line)}
        h2 .num{display:inline-block;min-width:1.6rem;height:1.6rem;margin-right:.5rem;border-radius:50%;background:var(--ink);color:var(--paper);text-align:center;font-size:.9rem;line-height:1.6rem}
        h3{font-size:1rem;margin:1.2rem 0 .4rem}
        .verdict{display:flex;align-items:baseline;gap:1rem;flex-wrap:wrap;border-left:10px solid;padding:.6rem 1rem;margin:0 0 .8rem}
        .verdict-word{font-size:2rem;font-weight:800;letter-spacing:.08em;margin:0}
        .verdict-gloss{margin:0;font-size:1rem}
        .v-pass{border-color:var(--pass);background:var(--pass-bg);color:var(--pass)}
        .v-fail{border-color:var(--fail);background:var(--fail-bg);color:var(--fail)}
        .v-open{border-color:var(--open);background:var(--open-bg);color:var(--open)}
        .statement{margin:0 0 1rem;padding:.7rem 1rem;background:var(--panel);font-size:1.02rem;border-radius:4px}
        .statement p{margin:0}
        table{border-collapse:collapse;width:100%;margin:.4rem 0 1rem;font-size:.9rem}
        caption{text-align:left;font-weight:600;padding:.3rem 0;color:var(--ink)}
        th,td{padding:.3rem .5rem;border-bottom:1px solid var(--line);text-align:left;vertical-align:top}
        thead th{border-bottom:2px solid var(--ink);font-weight:600;white-space:nowrap}
        tbody th{font-weight:500}
        .n{text-align:right;font-variant-numeric:tabular-nums;white-space:nowrap}
        table.spec{max-width:40rem}
        .tag{display:inline-block;padding:0 .45rem;border-radius:3px;font-size:.82rem;font-weight:600;white-space:nowrap}
        .t-pass{background:var(--pass-bg);color:var(--pass)}
        .t-fail{background:var(--fail-bg);color:var(--fail)}
        .t-warn,.t-none{background:var(--open-bg);color:var(--open)}
        .counts{display:flex;flex-wrap:wrap;gap:.5rem;margin:.4rem 0 0;padding:0}
        .counts div{background:var(--panel);padding:.3rem .8rem;border-radius:4px}
        .counts dt{font-size:.75rem;color:var(--muted);text-transform:uppercase;letter-spacing:.06em}
        .counts dd{margin:0;font-size:1.15rem;font-weight:700;font-variant-numeric:tabular-nums}
        .small{font-size:.85rem;color:var(--muted)}
        .none{font-style:italic;color:var(--muted)}
        .plot-grid{display:grid;grid-template-columns:repeat(auto-fit,minmax(24rem,1fr));gap:1rem}
        figure{margin:0 0 1rem;background:#fff;border:1px solid var(--line);border-radius:4px;padding:.5rem}
        .reading{background:var(--panel);border-radius:4px;padding:.6rem 1rem;font-size:.88rem;align-self:start}
        .reading h3{margin:.2rem 0 .4rem}.reading ul{padding-left:1.1rem;margin:0}.reading li{margin:.35rem 0}
        figcaption{font-size:.85rem;color:var(--muted);padding:.3rem .2rem 0}
        .legend{display:block;margin-top:.2rem}
        .key{display:inline-block;width:1.4rem;height:.7rem;margin:0 .25rem 0 .6rem;vertical-align:middle}
        .k-pt{background:radial-gradient(circle,var(--dot) 40%,transparent 45%)}
        .k-ptx{background:radial-gradient(circle,transparent 30%,var(--fail) 32%,var(--fail) 42%,transparent 45%)}
        .k-50{border-top:2px dashed var(--c50)}.k-95{border-top:2px solid var(--c95)}.k-ell{border-top:2px dotted var(--ell)}
        .k-mk{background:linear-gradient(var(--ink),var(--ink)) center/.6rem .6rem no-repeat}.k-vec{border-top:2px solid var(--rule)}
        .k-ecdf{border-top:2px solid var(--ink)}.k-model{border-top:2px solid var(--model)}.k-level{border-top:1px dashed var(--muted)}
        .k-mean{border-top:2px dashed var(--ink)}.k-v95{border-top:2px dotted var(--fail)}
        svg.plot{width:100%;height:auto;display:block;font-family:system-ui,sans-serif}
        svg .grid{stroke:#e6e1d5;stroke-width:1}
        svg .zero{stroke:#9a9384;stroke-width:1}
        svg .frame{fill:none;stroke:#9a9384}
        svg .tick{font-size:9px;fill:var(--muted)}
        svg .axis-title{font-size:10.5px;fill:var(--ink)}
        svg .pt{fill:var(--dot);fill-opacity:.85;stroke:#fff;stroke-width:.6}
        svg .pt-x{fill:none;stroke:var(--fail);stroke-width:1.4}
        svg .ring-50{fill:none;stroke:var(--c50);stroke-width:1.6;stroke-dasharray:5 3}
        svg .ring-95{fill:none;stroke:var(--c95);stroke-width:1.8}
        svg .ellipse-95{fill:var(--ell);fill-opacity:.07;stroke:var(--ell);stroke-width:1.6;stroke-dasharray:1.5 2.5}
        svg .vec{stroke:var(--rule);stroke-width:1.5}
        svg .vec-x{stroke:var(--fail);stroke-dasharray:3 2}
        svg .arrowhead{fill:var(--rule)}
        svg .mk{fill:var(--ink)}
        svg .mk-label{font-size:8px;fill:var(--muted)}
        svg .scalebar .bar-a{fill:var(--ink)}svg .scalebar .bar-b{fill:#fff;stroke:var(--ink)}
        svg .north path{fill:var(--ink)}svg .north-label{font-size:10px;font-weight:700;fill:var(--ink)}
        svg .model{fill:none;stroke:var(--model);stroke-width:2;stroke-opacity:.75}
        svg .ecdf{fill:none;stroke:var(--ink);stroke-width:1.4}
        svg .level{stroke:var(--muted);stroke-dasharray:4 3;stroke-width:.8}
        svg .mean{stroke:var(--ink);stroke-dasharray:6 3;stroke-width:1.2}
        svg .level-95{stroke:var(--fail);stroke-dasharray:1.5 2.5;stroke-width:1.6}
        svg .stem{stroke:#b5ad9c;stroke-width:1}
        svg .series polyline{fill:none;stroke-width:1.8}svg .s-nh polyline{stroke:var(--dot)}svg .s-nh circle{fill:var(--dot)}svg .s-rh polyline{stroke:var(--dot);stroke-dasharray:5 3}svg .s-rh circle{fill:#fff;stroke:var(--dot)}
        svg .s-nv polyline{stroke:var(--rule)}svg .s-nv circle{fill:var(--rule)}svg .s-rv polyline{stroke:var(--rule);stroke-dasharray:5 3}svg .s-rv circle{fill:#fff;stroke:var(--rule)}
        .k-nh{border-top:2px solid var(--dot)}.k-rh{border-top:2px dashed var(--dot)}.k-nv{border-top:2px solid var(--rule)}.k-rv{border-top:2px dashed var(--rule)}
        .choice{border:0;padding:0;margin:0 0 .6rem}.upload .choice label{display:inline;font-weight:400;margin-right:1.2rem}.upload input[type=text],.upload input:not([type]){font:inherit;padding:.3rem;border:1px solid #9a9384;border-radius:4px;width:100%;max-width:24rem}
        tr.excluded td,tr.excluded th{color:var(--muted);text-decoration:line-through;text-decoration-color:#b5ad9c}
        tr.flagged{background:var(--open-bg)}
        .why{text-decoration:none}
        .items{max-width:14rem;word-break:break-word}
        .frames{display:grid;grid-template-columns:max-content 1fr;gap:.2rem 1rem;margin:0}
        .frames div{display:contents}.frames dt{font-weight:600}.frames dd{margin:0}
        .steps li,.cautions li{margin:.2rem 0}
        .cautions{padding-left:1.2rem}
        .upload label{display:block;font-weight:600;margin-bottom:.25rem}
        .upload textarea{width:100%;font:13px/1.45 ui-monospace,Menlo,Consolas,monospace;padding:.5rem;border:1px solid #9a9384;border-radius:4px;background:#fff;color:var(--ink)}
        .upload button{font:inherit;font-weight:700;padding:.45rem 1.2rem;border:0;border-radius:4px;background:var(--ink);color:var(--paper);cursor:pointer}
        .upload button:focus-visible,.upload input:focus-visible,.upload textarea:focus-visible{outline:3px solid var(--rule);outline-offset:2px}
        .upload .field{margin:0 0 1rem}
        .upload input[type=text],.upload select{font:inherit;padding:.35rem .5rem;border:1px solid #6f6a5f;border-radius:4px;background:#fff;color:var(--ink);max-width:100%}
        .upload input[type=text]{width:24rem}
        .upload input[aria-invalid=true],.upload select[aria-invalid=true]{border:2px solid var(--fail)}
        .upload .inline{display:flex;flex-wrap:wrap;gap:.4rem;align-items:center}
        .upload .inline label.unit{display:inline;font-weight:400;margin:0}
        .upload button.secondary{background:var(--panel);color:var(--ink);border:1px solid var(--ink);font-weight:600;padding:.3rem .9rem}
        .upload select:focus-visible,.upload button:focus-visible{outline:3px solid var(--rule);outline-offset:2px}
        a.button{display:inline-block;font-weight:700;padding:.5rem 1.3rem;border-radius:4px;background:var(--ink);color:var(--paper);text-decoration:none}
        a.button:focus-visible{outline:3px solid var(--rule);outline-offset:2px}
        .hint{font-size:.85rem;color:var(--muted);margin:.1rem 0 .3rem}
        .field-error{color:var(--fail);background:var(--fail-bg);border-left:4px solid var(--fail);padding:.2rem .5rem;margin:.2rem 0 .3rem;font-size:.9rem}
        .error-summary{border:3px solid var(--fail);padding:.4rem 1rem;margin:1rem 0;background:#fff}
        .error-summary h2{margin:.3rem 0;border:0;color:var(--fail)}
        .error-summary a{color:var(--fail);font-weight:600}
        .chosen{margin:.3rem 0 0;font-size:.9rem}
        .matches{border:1px solid var(--line);border-radius:4px;margin:0 0 1rem;padding:.4rem .8rem;max-height:22rem;overflow-y:auto}
        .matches legend{font-weight:600;padding:0 .3rem}
        .upload .choice label{display:inline;font-weight:400}
        .choice{margin:.2rem 0}
        .columns{border:1px solid var(--line);border-radius:4px;padding:.4rem .8rem;margin:.6rem 0 1rem}
        .columns legend{font-weight:600;padding:0 .3rem}
        .colmap{display:grid;grid-template-columns:repeat(auto-fill,minmax(15rem,1fr));gap:0 1rem}
        .colmap .field{margin:.3rem 0}
        .upload .colmap label{font-weight:400}
        .scroll{overflow-x:auto}
        .scroll:focus-visible{outline:3px solid var(--rule)}
        .row-errors code{white-space:pre-wrap;word-break:break-all}
        .progress{margin:.6rem 0}.progress progress{width:20rem;max-width:100%;vertical-align:middle}
        .visually-hidden{position:absolute;width:1px;height:1px;overflow:hidden;clip:rect(0 0 0 0);white-space:nowrap;border:0;padding:0;margin:-1px}
        footer{margin-top:2.5rem;padding-top:.6rem;border-top:1px solid var(--line);font-size:.8rem;color:var(--muted)}
        .skip{position:absolute;left:-999px}.skip:focus{left:1rem;top:1rem;background:#fff;padding:.3rem}
        @page{margin:15mm 15mm 16mm}
        @media print{
          html{background:#fff}
          body{max-width:none;padding:0;font-size:9.5pt}
          a{color:inherit;text-decoration:none}
          .no-print,.skip{display:none}
          h2{break-after:avoid;margin-top:1.2rem}
          figure,table.spec,.verdict,.statement,tr{break-inside:avoid}
          thead{display:table-header-group}
          .plot-grid{grid-template-columns:1fr 1fr;gap:4mm}
          #fig-cdf{grid-column:1 / span 2;width:60%}
          figure{border-color:#ccc;padding:2mm}
          .verdict,.statement,.counts div,tr.flagged,.tag{-webkit-print-color-adjust:exact;print-color-adjust:exact}
        }
        """;
}
