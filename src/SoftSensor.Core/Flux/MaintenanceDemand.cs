namespace SoftSensor.Core.Flux;

/// <summary>
/// Non-growth-associated maintenance (Pirt 1965, Proc. R. Soc. Lond. B 163): the ATP drained per
/// unit of biomass and time regardless of growth. The maintenance reaction's flux is fixed, not free:
/// v_maint [mmol ATP/(L·h)] = m_ATP [mmol ATP/(C-mmol·h)] * X [C-mmol/L]. This makes the flux model
/// affine in the basis (v = a * r_X + b * m_ATP * X), so a zero growth rate still consumes substrate.
/// </summary>
/// <param name="Reaction">The reaction that drains ATP (e.g. <c>ATP -&gt;</c>).</param>
/// <param name="AtpMmolPerCmmolBiomassPerH">m_ATP per C-mmol of biomass (converted from per gram dry weight when the file gives that).</param>
/// <param name="Source">Where the value comes from.</param>
public sealed record MaintenanceDemand(string Reaction, double AtpMmolPerCmmolBiomassPerH, string Source);
