using System.Buffers;
using System.Net;
using System.Security.Cryptography.X509Certificates;
using MQTTnet.Channel;

namespace RunWatch.Ingest.Mqtt;

/// <summary>
/// Wraps the connection's transport so that the PUBACKs of one committed batch leave in one socket write instead of
/// one write each: between <see cref="HoldAsync"/> and <see cref="ReleaseAsync"/> every packet is copied into a buffer, in
/// order, and the buffer is written at release. Outside a hold, writes pass straight through. A gate keeps the two in
/// order, so a keep-alive sent during a hold goes out after the acks queued before it, never in the middle of them.
/// Reads are untouched.
/// </summary>
internal sealed class CoalescingChannel(IMqttChannel inner) : IMqttChannel
{
    private readonly SemaphoreSlim _gate = new(1, 1);
    private readonly ArrayBufferWriter<byte> _held = new(16 * 1024);
    private bool _holding;

    public X509Certificate2 ClientCertificate => inner.ClientCertificate;

    public EndPoint RemoteEndPoint => inner.RemoteEndPoint;

    public EndPoint LocalEndPoint => inner.LocalEndPoint;

    public bool IsSecureConnection => inner.IsSecureConnection;

    /// <summary>Writes of held packets made so far, one per release that had something to send (diagnostics and tests).</summary>
    public long CoalescedWrites { get; private set; }

    public Task ConnectAsync(CancellationToken cancellationToken) => inner.ConnectAsync(cancellationToken);

    public Task DisconnectAsync(CancellationToken cancellationToken) => inner.DisconnectAsync(cancellationToken);

    public Task<int> ReadAsync(byte[] buffer, int offset, int count, CancellationToken cancellationToken) =>
        inner.ReadAsync(buffer, offset, count, cancellationToken);

    public async Task WriteAsync(ReadOnlySequence<byte> buffer, bool isEndOfPacket, CancellationToken cancellationToken)
    {
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            if (_holding)
            {
                // The caller reuses its buffer as soon as this returns: keep a copy.
                foreach (var segment in buffer)
                {
                    segment.Span.CopyTo(_held.GetSpan(segment.Length));
                    _held.Advance(segment.Length);
                }
                return;
            }
            await inner.WriteAsync(buffer, isEndOfPacket, cancellationToken).ConfigureAwait(false);
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>From now on packets are kept until <see cref="ReleaseAsync"/>.</summary>
    public async Task HoldAsync(CancellationToken cancellationToken)
    {
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        _holding = true;
        _gate.Release();
    }

    /// <summary>Ends the hold and writes what was kept in one write; throws when the transport fails (nothing kept is then sent).</summary>
    public async Task ReleaseAsync(CancellationToken cancellationToken)
    {
        await _gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            _holding = false;
            if (_held.WrittenCount == 0)
            {
                return;
            }
            try
            {
                await inner.WriteAsync(new ReadOnlySequence<byte>(_held.WrittenMemory), isEndOfPacket: true, cancellationToken).ConfigureAwait(false);
                CoalescedWrites++;
            }
            finally
            {
                _held.ResetWrittenCount();
            }
        }
        finally
        {
            _gate.Release();
        }
    }

    public void Dispose()
    {
        inner.Dispose();
        _gate.Dispose();
    }
}
