using Npgsql;
using RunWatch.Storage.Postgres;
using RunWatch.Testing.Postgres;

namespace RunWatch.Storage.Tests.Postgres;

/// <summary>Chamber ownership through session-level advisory locks on a real server, with two daemons' sessions.</summary>
public sealed class ChamberOwnershipSessionTests
{
    private static ChamberOwnershipSession Session(string database, string instance) =>
        new(database, instance, TimeSpan.FromSeconds(2), TimeSpan.FromSeconds(5));

    [Fact]
    public async Task TryAcquireAsync_OtherDaemonHoldsChamber_RefusedUntilItCloses()
    {
        var server = await PostgresServer.SharedAsync();
        string database = await server.CreateDatabaseAsync("owner");
        try
        {
            await using var first = Session(database, "daemon-a");
            await using var second = Session(database, "daemon-b");

            Assert.True(await first.TryAcquireAsync(1, CancellationToken.None));
            Assert.True(await first.TryAcquireAsync(2, CancellationToken.None));
            Assert.False(await second.TryAcquireAsync(1, CancellationToken.None));
            Assert.True(await second.TryAcquireAsync(3, CancellationToken.None));
            var owners = await ChamberOwnershipSession.ReadOwnersAsync(database, CancellationToken.None);
            Assert.Equal([(1L, "daemon-a"), (2L, "daemon-a"), (3L, "daemon-b")], owners.Select(o => (o.ChamberId, o.Instance)));

            await first.DisposeAsync();

            // The server releases the closed session's locks when its backend has ended, a moment after the close.
            Assert.True(await AcquireWithinAsync(second, 1, TimeSpan.FromSeconds(10)));
            Assert.True(await second.TryAcquireAsync(2, CancellationToken.None));
            Assert.Equal([1L, 2L, 3L], (await second.VerifyAsync(CancellationToken.None)).Order());
        }
        finally
        {
            await server.DropDatabaseAsync(database);
        }
    }

    [Fact]
    public async Task VerifyAsync_SessionCutByServer_OwnsNothingAndOtherDaemonTakesOver()
    {
        // The server ends the owner's session (as when the host is cut off and keepalive gives up, or an operator
        // terminates it): the locks go with it, the other daemon gets them, and the old owner learns it owns nothing.
        var server = await PostgresServer.SharedAsync();
        string database = await server.CreateDatabaseAsync("owner");
        try
        {
            await using var first = Session(database, "daemon-a");
            await using var second = Session(database, "daemon-b");
            Assert.True(await first.TryAcquireAsync(7, CancellationToken.None));
            Assert.False(await second.TryAcquireAsync(7, CancellationToken.None));

            await using (var admin = new NpgsqlConnection(new NpgsqlConnectionStringBuilder(database) { Pooling = false }.ConnectionString))
            {
                await admin.OpenAsync();
                await using var terminate = new NpgsqlCommand(
                    "SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE application_name = @name", admin);
                terminate.Parameters.AddWithValue("name", ChamberOwnershipSession.ApplicationNamePrefix + "daemon-a");
                await terminate.ExecuteNonQueryAsync();
            }

            Assert.True(await AcquireWithinAsync(second, 7, TimeSpan.FromSeconds(10)));
            Assert.Empty(await first.VerifyAsync(CancellationToken.None));
            Assert.False(await first.TryAcquireAsync(7, CancellationToken.None));
            Assert.Equal("daemon-b", Assert.Single(await ChamberOwnershipSession.ReadOwnersAsync(database, CancellationToken.None)).Instance);
        }
        finally
        {
            await server.DropDatabaseAsync(database);
        }
    }

    /// <summary>Tries to take the chamber until <paramref name="timeout"/>, as the daemon's claim loop does every tick.</summary>
    private static async Task<bool> AcquireWithinAsync(ChamberOwnershipSession session, long chamberId, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (!await session.TryAcquireAsync(chamberId, CancellationToken.None))
        {
            if (DateTime.UtcNow > deadline)
            {
                return false;
            }
            await Task.Delay(20);
        }
        return true;
    }
}
