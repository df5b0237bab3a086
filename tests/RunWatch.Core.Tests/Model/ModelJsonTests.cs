using System.Text.Json;
using RunWatch.Core.Model;
using Xunit;

namespace RunWatch.Core.Tests.Model;

public sealed class ModelJsonTests
{
    [Fact]
    public void Serialize_ModelStateWithArrhenius_RoundTripsEveryNumberAndWaferId()
    {
        ArrheniusFit arrhenius = ArrheniusCalibration.Fit(
        [
            new ArrheniusPoint("W-1", 300, 1800, 860, 4),
            new ArrheniusPoint("W-2", 420, 1800, 880, 4),
            new ArrheniusPoint("W-3", 560, 1700, 900, 4),
        ]);
        CalibrationRecord candidate = ProcessModelStateTests.Candidate("c1") with { Arrhenius = arrhenius };
        ProcessModelState state = ProcessModelState.Empty("nw-gaas-std").Propose(candidate).Accept("c1", "engineer-a", DateTimeOffset.UnixEpoch, "ok");

        string json = ModelJson.Serialize(state);
        ProcessModelState back = ModelJson.Deserialize<ProcessModelState>(json);

        Assert.Contains("\"selected\": \"PowerLaw\"", json, StringComparison.Ordinal);
        Assert.Equal(json, ModelJson.Serialize(back));
        RadiusModelFit original = candidate.RadiusModel!.PowerLaw;
        RadiusModelFit restored = back.Accepted!.Record.RadiusModel!.PowerLaw;
        Assert.Equal(original.Parameters[1].Value, restored.Parameters[1].Value);
        Assert.Equal(original.Aic, restored.Aic);
        Assert.Equal(["W-1", "W-2", "W-3"], back.Accepted.Record.Arrhenius!.WaferIds);
        Assert.Equal(["W-DEMO-1", "W-DEMO-2"], back.Accepted.Record.WaferIds);
        Assert.Equal("engineer-a", back.Accepted.Acceptance.AcceptedBy);
    }

    [Fact]
    public void Deserialize_Malformed_ThrowsJsonException()
    {
        Assert.ThrowsAny<JsonException>(() => ModelJson.Deserialize<CalibrationRecord>("{\"id\": "));
        Assert.ThrowsAny<JsonException>(() => ModelJson.Deserialize<CalibrationRecord>("null"));
    }
}
