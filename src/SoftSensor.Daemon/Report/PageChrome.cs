using System.Net;

namespace SoftSensor.Daemon.Report;

/// <summary>
/// What every page of the status server shares: the head with one stylesheet (inline: no external
/// scripts, fonts or styles), the navigation between the pages, and the advisory caution at the foot.
/// </summary>
internal static class PageChrome
{
    /// <summary>The pages of the navigation: path, label, id of the active marker.</summary>
    public static readonly (string Path, string Label, string Id)[] Pages =
    [
        ("/", "Status", "status"),
        ("/batches", "Batches", "batches"),
        ("/samples", "Lab samples", "samples"),
        ("/reports", "Batch reports", "reports"),
        ("/metrics", "Metrics", "metrics"),
    ];

    /// <summary>The shared stylesheet.</summary>
    public const string Style = """
      :root { --ink: #1d2430; --muted: #5b6675; --line: #d5dae1; --paper: #fbfbf8; --card: #fff; --accent: #27558c; --good: #2f7d4f; --unc: #a36a00; --bad: #b3261e; }
      * { box-sizing: border-box; }
      body { margin: 0; font: 14px/1.45 system-ui, sans-serif; color: var(--ink); background: var(--paper); }
      header.top { padding: 8px 18px; border-bottom: 1px solid var(--line); display: flex; gap: 18px; align-items: baseline; flex-wrap: wrap; background: var(--card); }
      header.top h1 { font-size: 17px; margin: 0; letter-spacing: .02em; }
      header.top nav { display: flex; gap: 4px; flex-wrap: wrap; }
      header.top nav a { color: var(--accent); text-decoration: none; padding: 2px 8px; border-radius: 4px; }
      header.top nav a.active { background: var(--accent); color: #fff; }
      header.top .meta { color: var(--muted); }
      main { padding: 12px 18px; max-width: 1400px; }
      h2 { font-size: 15px; margin: 0 0 8px; }
      h3 { font-size: 14px; margin: 14px 0 6px; }
      section.card, section.reactor { border: 1px solid var(--line); border-radius: 6px; padding: 10px 14px; margin-bottom: 16px; background: var(--card); }
      .values { display: flex; flex-wrap: wrap; gap: 8px; }
      .value { border: 1px solid var(--line); border-left-width: 5px; border-radius: 4px; padding: 4px 10px; min-width: 170px; }
      .value .n { color: var(--muted); font-size: 12px; }
      .value .v { font-size: 20px; font-variant-numeric: tabular-nums; }
      .value .u { color: var(--muted); font-size: 12px; }
      .value .why { color: var(--unc); font-size: 11px; max-width: 220px; }
      .q-good { border-left-color: var(--good); } .q-uncertain { border-left-color: var(--unc); } .q-bad { border-left-color: var(--bad); }
      .tag { font-size: 11px; padding: 0 5px; border-radius: 3px; color: #fff; }
      .tag.good { background: var(--good); } .tag.uncertain { background: var(--unc); } .tag.bad { background: var(--bad); }
      .trends { display: grid; grid-template-columns: repeat(auto-fill, minmax(340px, 1fr)); gap: 10px; margin-top: 10px; }
      .trend { border: 1px solid var(--line); border-radius: 4px; padding: 4px 6px; }
      .trend .t { font-size: 12px; color: var(--muted); }
      .trend svg { width: 100%; height: auto; display: block; }
      .trend svg text { font-size: 10px; fill: var(--muted); }
      table { border-collapse: collapse; width: 100%; margin-top: 8px; font-size: 13px; }
      th, td { text-align: left; padding: 3px 8px; border-bottom: 1px solid var(--line); vertical-align: top; }
      th { color: var(--muted); font-weight: 600; }
      td.num { text-align: right; font-variant-numeric: tabular-nums; }
      details { margin-top: 8px; } summary { cursor: pointer; color: var(--accent); }
      form.entry { display: flex; flex-direction: column; gap: 4px; max-width: 560px; margin: 8px 0; }
      form.entry label { display: flex; justify-content: space-between; gap: 10px; }
      form.entry br { display: none; }
      form.entry button { align-self: flex-start; }
      label { color: var(--muted); }
      input, select, button { font: inherit; padding: 2px 6px; }
      button { background: var(--accent); color: #fff; border: 0; border-radius: 4px; padding: 3px 12px; cursor: pointer; }
      #outcome { border-left: 4px solid var(--accent); padding: 4px 10px; background: var(--card); }
      .caution { color: var(--muted); font-size: 12px; padding: 0 18px 18px; max-width: 1400px; }
      .empty { color: var(--muted); }
      """;

    /// <summary>The document's start up to and including the navigation; <paramref name="active"/> is a page id of <see cref="Pages"/>.</summary>
    public static string Top(string title, string active) =>
        "<!doctype html><html lang=\"en\"><head><meta charset=\"utf-8\"><meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">"
        + $"<title>SoftSensor · {WebUtility.HtmlEncode(title)}</title><style>{Style}</style></head><body>"
        + Nav(active) + "<main>";

    /// <summary>The navigation bar (the status page's template takes it too).</summary>
    public static string Nav(string active) =>
        "<header class=\"top\"><h1>SoftSensor</h1><nav id=\"nav\">"
        + string.Concat(Pages.Select(p => $"<a href=\"{p.Path}\"{(p.Id == active ? " class=\"active\"" : "")}>{p.Label}</a>"))
        + "</nav><span class=\"meta\" id=\"broker\"></span><span class=\"meta\" id=\"updated\"></span><span class=\"meta\" id=\"store\"></span></header>";

    /// <summary>The advisory caution every page ends with.</summary>
    public const string Caution = "<p class=\"caution\">Advisory only: not a safety instrumented system. Estimates are only as good as their inputs; treat an uncertain or bad value as a prompt to look at the plant. Local codes and licensed practice take precedence.</p>";

    /// <summary>The document's end.</summary>
    public const string Bottom = "</main>" + Caution + "</body></html>";
}
