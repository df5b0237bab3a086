using Microsoft.Extensions.Logging.Abstractions;
using RunWatch.Web.Data;
using RunWatch.Web.Live;
using Xunit;

namespace RunWatch.Web.Tests.Live;

public sealed class LiveUpdateHubTests
{
    [Fact]
    public void SamplesCommitted_TwoChambers_OneUpdatePerChamber()
    {
        var hub = new LiveUpdateHub(NullLogger<LiveUpdateHub>.Instance);
        var got = new List<LiveUpdate>();
        using var _ = hub.Subscribe(got.Add);
        var t = DateTimeOffset.UnixEpoch;

        hub.SamplesCommitted([new LiveSample("a", "x", t, 1), new LiveSample("b", "x", t, 2), new LiveSample("a", "y", t, 3)]);

        Assert.Equal(["a", "b"], got.Select(u => u.Chamber));
        Assert.Equal(2, got[0].Samples.Count);
    }

    [Fact]
    public void Publish_FailingSubscriber_OthersStillServed()
    {
        var hub = new LiveUpdateHub(NullLogger<LiveUpdateHub>.Instance);
        int served = 0;
        using var bad = hub.Subscribe(_ => throw new InvalidOperationException("boom"));
        using var good = hub.Subscribe(_ => served++);

        hub.AlertsChanged("a");

        Assert.Equal(1, served);
    }

    [Fact]
    public void Dispose_Subscription_StopsUpdates()
    {
        var hub = new LiveUpdateHub(NullLogger<LiveUpdateHub>.Instance);
        int served = 0;
        var subscription = hub.Subscribe(_ => served++);
        subscription.Dispose();
        hub.RunsChanged("a");
        Assert.Equal(0, served);
        Assert.Equal(0, hub.SubscriberCount);
    }
}
