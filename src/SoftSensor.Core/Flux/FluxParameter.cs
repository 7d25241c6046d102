namespace SoftSensor.Core.Flux;

/// <summary>A named number of the network (P/O ratio, ATP per C-mol biomass) used as a coefficient <c>{name}</c> in reactions.</summary>
/// <param name="Name">Parameter name.</param>
/// <param name="Value">Its value.</param>
/// <param name="Unit">Unit text from the model file (may be empty).</param>
/// <param name="Source">Where the value comes from, from the model file (may be empty).</param>
public sealed record FluxParameter(string Name, double Value, string Unit, string Source);
