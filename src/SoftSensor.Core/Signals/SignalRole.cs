namespace SoftSensor.Core.Signals;

/// <summary>
/// What a plant tag means to the cycle. The unit of each role is fixed and in its name; edge
/// adapters convert from the tag's plant unit (tag map: unit and scale) before a value gets here.
/// </summary>
public enum SignalRole
{
    /// <summary>Air line, mass flow controller reading at its reference conditions, NL/min.</summary>
    AirFlowNlPerMin = 0,
    /// <summary>Pure O2 line (enrichment), NL/min.</summary>
    OxygenFlowNlPerMin,
    /// <summary>Pure N2 line, NL/min.</summary>
    NitrogenFlowNlPerMin,
    /// <summary>Pure CO2 line, NL/min.</summary>
    CarbonDioxideFlowNlPerMin,
    /// <summary>Inlet (reference) O2 reading, % by volume on the analyser's basis.</summary>
    InletO2Percent,
    /// <summary>Inlet (reference) CO2 reading, % by volume.</summary>
    InletCo2Percent,
    /// <summary>Off-gas O2, % by volume as read by the analyser.</summary>
    OutletO2Percent,
    /// <summary>Off-gas CO2, % by volume as read by the analyser.</summary>
    OutletCo2Percent,
    /// <summary>Vessel head pressure, absolute, kPa.</summary>
    PressureKPa,
    /// <summary>Broth temperature, °C.</summary>
    TemperatureC,
    /// <summary>Liquid volume from the controller, L.</summary>
    LiquidVolumeL,
    /// <summary>Vessel net weight (load cell), kg.</summary>
    WeightKg,
    /// <summary>Substrate feed pump, L/h.</summary>
    FeedRateLPerH,
    /// <summary>Base (ammonia) addition, L/h.</summary>
    BaseRateLPerH,
    /// <summary>Dissolved oxygen, % of air saturation.</summary>
    DissolvedOxygenPercent,
    /// <summary>Broth pH.</summary>
    Ph,
    /// <summary>Temperature of the analyser cell or condenser, °C (saturated-basis correction).</summary>
    AnalyserTemperatureC,
    /// <summary>Analyser is calibrating or switched to the reference stream (1 = yes).</summary>
    AnalyserCalibrating,
    /// <summary>Totaliser of broth removed by samples and harvests since the start, L.</summary>
    RemovedVolumeL,

    /// <summary>The batch id from the controller (text, or a number used as text); not an input of the cycle: a change starts a new batch.</summary>
    BatchId,

    /// <summary>The controller's numeric phase code, mapped to a phase by the reactor's <c>batches:phaseCodes</c>; not an input of the cycle.</summary>
    BatchPhaseCode,

    /// <summary>Jacket coolant flow, L/h (heat balance, docs/pathway.md §4).</summary>
    CoolantFlowLPerH,
    /// <summary>Jacket coolant inlet temperature, °C.</summary>
    CoolantInletTemperatureC,
    /// <summary>Jacket coolant outlet temperature, °C.</summary>
    CoolantOutletTemperatureC,
    /// <summary>Stirrer shaft power, W.</summary>
    StirrerPowerW,
    /// <summary>Stirrer speed, 1/min (the power then follows from the power number).</summary>
    StirrerSpeedRpm,
}

/// <summary>Helpers on <see cref="SignalRole"/>.</summary>
public static class SignalRoles
{
    /// <summary>True for the batch roles, whose samples drive the batch lifecycle instead of entering the cycle.</summary>
    public static bool IsBatchRole(SignalRole role) => role is SignalRole.BatchId or SignalRole.BatchPhaseCode;

    /// <summary>Number of roles.</summary>
    public const int Count = (int)SignalRole.StirrerSpeedRpm + 1;

    /// <summary>The unit of a role's value, as shown to users.</summary>
    public static string UnitOf(SignalRole role) => role switch
    {
        SignalRole.AirFlowNlPerMin or SignalRole.OxygenFlowNlPerMin or SignalRole.NitrogenFlowNlPerMin
            or SignalRole.CarbonDioxideFlowNlPerMin => "NL/min",
        SignalRole.InletO2Percent or SignalRole.InletCo2Percent or SignalRole.OutletO2Percent
            or SignalRole.OutletCo2Percent or SignalRole.DissolvedOxygenPercent => "%",
        SignalRole.PressureKPa => "kPa",
        SignalRole.TemperatureC or SignalRole.AnalyserTemperatureC or SignalRole.CoolantInletTemperatureC
            or SignalRole.CoolantOutletTemperatureC => "°C",
        SignalRole.CoolantFlowLPerH => "L/h",
        SignalRole.StirrerPowerW => "W",
        SignalRole.StirrerSpeedRpm => "1/min",
        SignalRole.LiquidVolumeL or SignalRole.RemovedVolumeL => "L",
        SignalRole.WeightKg => "kg",
        SignalRole.FeedRateLPerH or SignalRole.BaseRateLPerH => "L/h",
        SignalRole.Ph => "pH",
        SignalRole.AnalyserCalibrating => "1",
        SignalRole.BatchId => "id",
        SignalRole.BatchPhaseCode => "code",
        _ => throw new ArgumentOutOfRangeException(nameof(role), role, "unknown signal role"),
    };
}
