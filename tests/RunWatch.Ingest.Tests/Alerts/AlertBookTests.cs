using RunWatch.Core.Excursions;
using RunWatch.Ingest.Alerts;
using RunWatch.Storage;

namespace RunWatch.Ingest.Tests.Alerts;

public sealed class AlertBookTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    [Fact]
    public void Apply_RaiseAcknowledgeClear_FollowsIsa182AndLeavesTheBook()
    {
        var book = new AlertBook();

        var raised = book.Apply(Signal(AlarmState.ActiveUnacknowledged, 0));
        var acked = book.Apply(Signal(AlarmState.ActiveAcknowledged, 10), "operator");
        var cleared = book.Apply(Signal(AlarmState.Normal, 20));

        Assert.Equal(("raised", AlertState.Unacknowledged), (raised!.Value.Change, raised.Value.Alert.State));
        Assert.Equal(AlertSeverity.High, raised.Value.Alert.Severity);
        Assert.Equal(("acknowledged", AlertState.Acknowledged), (acked!.Value.Change, acked.Value.Alert.State));
        Assert.Equal("operator", acked.Value.Alert.AcknowledgedBy);
        Assert.Equal(("cleared", AlertState.Normal), (cleared!.Value.Change, cleared.Value.Alert.State));
        Assert.Equal(T0.AddSeconds(20), cleared.Value.Alert.ClearedAt);
        Assert.Equal(T0, cleared.Value.Alert.RaisedAt);
        Assert.Empty(book.Current);
    }

    [Fact]
    public void Apply_SuppressedByDesignThenCleared_RecordedNeverRaised()
    {
        var book = new AlertBook();

        var suppressed = book.Apply(Signal(AlarmState.SuppressedByDesign, 0));
        var ended = book.Apply(Signal(AlarmState.Normal, 30));

        Assert.Equal((AlertBook.SuppressedChange, AlertState.Suppressed), (suppressed!.Value.Change, suppressed.Value.Alert.State));
        Assert.Equal(AlertBook.SuppressedDetail, suppressed.Value.Alert.DetailJson);
        Assert.Equal((AlertBook.SuppressionEndedChange, AlertState.Normal), (ended!.Value.Change, ended.Value.Alert.State));
        Assert.Null(ended.Value.Alert.AcknowledgedBy);
        Assert.Equal(AlertBook.SuppressedDetail, ended.Value.Alert.DetailJson);
        Assert.Empty(book.Current);
    }

    [Fact]
    public void Apply_SuppressedThenRaisedAtRampTimeout_RaisedFromThatMoment()
    {
        var book = new AlertBook();
        book.Apply(Signal(AlarmState.SuppressedByDesign, 0));

        var raised = book.Apply(Signal(AlarmState.ActiveUnacknowledged, 120));

        Assert.Equal(("raised", AlertState.Unacknowledged), (raised!.Value.Change, raised.Value.Alert.State));
        Assert.Equal(T0.AddSeconds(120), raised.Value.Alert.RaisedAt);
        Assert.Null(raised.Value.Alert.DetailJson);
    }

    [Fact]
    public void Apply_ReturnToNormalBeforeAcknowledge_StaysUntilAcknowledged()
    {
        var book = new AlertBook();
        book.Apply(Signal(AlarmState.ActiveUnacknowledged, 0));

        var returned = book.Apply(Signal(AlarmState.ReturnedToNormalUnacknowledged, 5));
        Assert.Equal(AlertState.ReturnedUnacknowledged, returned!.Value.Alert.State);
        Assert.Single(book.Current);

        var normal = book.Apply(Signal(AlarmState.Normal, 9), "operator");
        Assert.Equal("normal", normal!.Value.Change);
        Assert.Equal(T0.AddSeconds(9), normal.Value.Alert.AcknowledgedAt);
        Assert.Equal(T0.AddSeconds(5), normal.Value.Alert.ClearedAt);
        Assert.Empty(book.Current);
    }

    [Fact]
    public void Apply_ConditionReturnsWhileUnacknowledged_SameAlertActiveAgain()
    {
        var book = new AlertBook();
        var first = book.Apply(Signal(AlarmState.ActiveUnacknowledged, 0))!.Value.Alert;
        book.Update(first with { Id = 42 });
        book.Apply(Signal(AlarmState.ReturnedToNormalUnacknowledged, 5));

        var again = book.Apply(Signal(AlarmState.ActiveUnacknowledged, 8))!.Value.Alert;

        Assert.Equal(42, again.Id);
        Assert.Equal(AlertState.Unacknowledged, again.State);
        Assert.Null(again.ClearedAt);
    }

    [Fact]
    public void Apply_ChangeForUnknownAlert_ChangesNothing()
    {
        var book = new AlertBook();
        Assert.Null(book.Apply(Signal(AlarmState.Normal, 0)));
        Assert.Null(book.Apply(Signal(AlarmState.ActiveAcknowledged, 0)));
        Assert.Empty(book.Current);
    }

    private static AlertSignal Signal(AlarmState to, double seconds) =>
        new("C1/deviation-alarm", "C1", "lab", "deviation-alarm", to, T0.AddSeconds(seconds), 630, "test");
}
