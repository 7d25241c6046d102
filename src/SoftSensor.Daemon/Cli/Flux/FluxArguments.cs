namespace SoftSensor.Daemon.Cli.Flux;

/// <summary>The flux verb's options as given.</summary>
/// <param name="ModelFile">--model.</param>
/// <param name="Basis">--basis tokens, each ID=VALUE.</param>
/// <param name="BiomassGPerL">--biomass-g-per-l, or null.</param>
/// <param name="Json">--json.</param>
internal sealed record FluxArguments(string ModelFile, IReadOnlyList<string> Basis, double? BiomassGPerL, bool Json);
