using System.CommandLine;
using System.Globalization;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor sample add|list|show|corrected --reactor R ...</c>: offline samples and withdrawals to a
/// running daemon through its status API (<see cref="Samples.SampleEndpoints"/>), found as
/// <see cref="DaemonLocator"/> says. The options are the payload's fields (<see cref="Samples.SamplePayload"/>);
/// the daemon validates them. Prints the answer as text (<c>--json</c>: as the daemon sent it); exit 2 with
/// its problems on one stderr line when it refuses, 1 when unreachable.
/// </summary>
internal sealed class SampleVerb : IVerb
{
    public Command Build()
    {
        var client = new DaemonClient();
        var reactor = new Option<string>("--reactor") { Description = "reactor id", Required = true };
        var kind = new Option<string>("--kind") { Description = "dcw, od, substrate, product or removal", Required = true };
        var at = new Option<string>("--sampled-at") { Description = "sampling time, ISO 8601 with Z or an offset (e.g. 2026-03-01T10:00:00Z)", Required = true };
        var value = new Option<double?>("--value-g-per-l") { Description = "measured concentration (dcw, substrate, product), g/L" };
        var sigma = new Option<double?>("--sigma-g-per-l") { Description = "its standard uncertainty, g/L" };
        var od = new Option<double?>("--od") { Description = "optical density (dilution accounted for), OD units" };
        var odSigma = new Option<double?>("--od-sigma") { Description = "standard uncertainty of the OD" };
        var factor = new Option<double?>("--factor-g-per-l-per-od") { Description = "calibration factor, g/L dry weight per OD unit" };
        var factorSigma = new Option<double?>("--factor-sigma-g-per-l-per-od") { Description = "standard uncertainty of the calibration factor" };
        var withdrawn = new Option<double?>("--withdrawn-ml") { Description = "broth withdrawn with the sample (or for a removal), mL" };
        var analyte = new Option<string?>("--analyte") { Description = "what a substrate or product assay measured (e.g. glycerol)" };
        var who = new Option<string?>("--operator") { Description = "who entered it" };

        var add = client.On(new Command("add", "Enter an offline sample or a withdrawal") { reactor, kind, at, value, sigma, od, odSigma, factor, factorSigma, withdrawn, analyte, who });
        add.SetAction((p, ct) =>
        {
            var body = new Dictionary<string, object>(StringComparer.Ordinal) { ["kind"] = p.GetValue(kind)!, ["sampledAt"] = p.GetValue(at)! };
            void Put(string field, object? v)
            {
                if (v is not null)
                {
                    body[field] = v;
                }
            }

            Put("valueGPerL", p.GetValue(value));
            Put("sigmaGPerL", p.GetValue(sigma));
            Put("od", p.GetValue(od));
            Put("odSigma", p.GetValue(odSigma));
            Put("factorGPerLPerOd", p.GetValue(factor));
            Put("factorSigmaGPerLPerOd", p.GetValue(factorSigma));
            Put("withdrawnMl", p.GetValue(withdrawn));
            Put("analyte", p.GetValue(analyte));
            Put("operator", p.GetValue(who));
            return client.SendAsync(p, $"/api/samples/{Uri.EscapeDataString(p.GetValue(reactor)!)}", body, ct);
        });

        var batch = new Option<string?>("--batch") { Description = "only this batch's inputs" };
        var list = client.On(new Command("list", "List the inputs of a reactor, newest first, with their outcome") { reactor, batch });
        list.SetAction((p, ct) => client.SendAsync(p,
            $"/api/samples/{Uri.EscapeDataString(p.GetValue(reactor)!)}" + (p.GetValue(batch) is { } b ? "?batch=" + Uri.EscapeDataString(b) : ""), null, ct));
        var id = new Option<long>("--id") { Description = "input id (as add answered)", Required = true };
        var show = client.On(new Command("show", "Show one input and its outcome") { reactor, id });
        show.SetAction((p, ct) => client.SendAsync(p, Path(p.GetValue(reactor)!, "samples", p.GetValue(id)), null, ct));
        var corrected = client.On(new Command("corrected", "Show the corrected trajectory stored after an input") { reactor, id });
        corrected.SetAction((p, ct) => client.SendAsync(p, Path(p.GetValue(reactor)!, "corrected", p.GetValue(id)), null, ct));
        return new Command("sample", "Offline samples and withdrawals to a running daemon: add, list, show, corrected") { add, list, show, corrected };
    }

    private static string Path(string reactor, string what, long id) =>
        string.Create(CultureInfo.InvariantCulture, $"/api/{what}/{Uri.EscapeDataString(reactor)}/{id}");
}
