using RunWatch.Core.Model;
using Xunit;

namespace RunWatch.Core.Tests.Model;

public sealed class ProcessModelStateTests
{
    private static readonly DateTimeOffset Noon = new(2026, 3, 4, 12, 0, 0, TimeSpan.Zero);

    internal static CalibrationRecord Candidate(string id, string process = "nw-gaas-std")
    {
        (double[] x, double[] y) = SyntheticWafer.Make(RadiusModelKind.PowerLaw, 60, 0.5, 2, 50, id.Length);
        return new CalibrationRecord(id, process, Noon, ["W-DEMO-1", "W-DEMO-2"], RadiusModelFitter.FitAndSelect(x, y), [new WaferCaptureRadius("W-DEMO-1", 420, 0.93, false, 50)], null, "invented demo data");
    }

    [Fact]
    public void Propose_ThenAccept_MovesCandidateToAcceptedAndRecordsWho()
    {
        ProcessModelState state = ProcessModelState.Empty("nw-gaas-std").Propose(Candidate("c1"));
        Assert.Null(state.Accepted);

        state = state.Accept("c1", "engineer-a", Noon.AddHours(1), "checked residuals");

        Assert.Null(state.Proposed);
        Assert.Equal("c1", state.Accepted!.Record.Id);
        Assert.Equal("engineer-a", state.Accepted.Acceptance.AcceptedBy);
        Assert.Equal(Noon.AddHours(1), state.Accepted.Acceptance.AcceptedAt);
        Assert.Empty(state.History);
    }

    [Fact]
    public void Accept_SecondCandidate_KeepsPreviousInHistory()
    {
        ProcessModelState state = ProcessModelState.Empty("nw-gaas-std")
            .Propose(Candidate("c1")).Accept("c1", "engineer-a", Noon)
            .Propose(Candidate("c22")).Accept("c22", "engineer-b", Noon.AddDays(1));
        Assert.Equal("c22", state.Accepted!.Record.Id);
        Assert.Equal("c1", Assert.Single(state.History).Record.Id);
    }

    [Fact]
    public void Accept_WrongIdOrNothingProposed_ThrowsAndLeavesAcceptedUnchanged()
    {
        ProcessModelState accepted = ProcessModelState.Empty("nw-gaas-std").Propose(Candidate("c1")).Accept("c1", "engineer-a", Noon);
        Assert.Throws<InvalidOperationException>(() => accepted.Accept("c1", "engineer-a", Noon));
        ProcessModelState proposed = accepted.Propose(Candidate("c2"));
        Assert.Throws<InvalidOperationException>(() => proposed.Accept("c3", "engineer-a", Noon));
        Assert.Throws<ArgumentException>(() => proposed.Accept("c2", " ", Noon));
        Assert.Equal("c1", proposed.Accepted!.Record.Id);
    }

    [Fact]
    public void Propose_OtherProcess_Throws()
    {
        Assert.Throws<ArgumentException>(() => ProcessModelState.Empty("nw-gaas-std").Propose(Candidate("c1", "other")));
    }

    [Fact]
    public void Discard_DropsProposalOnly()
    {
        ProcessModelState state = ProcessModelState.Empty("p").Propose(Candidate("c1", "p")).Accept("c1", "e", Noon).Propose(Candidate("c2", "p")).Discard();
        Assert.Null(state.Proposed);
        Assert.Equal("c1", state.Accepted!.Record.Id);
    }
}
