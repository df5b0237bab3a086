namespace RunWatch.Imaging.Decoding;

/// <summary>The data of several PNG chunks read as one stream (the zlib stream spans every IDAT chunk).</summary>
internal sealed class ChunkDataStream(Stream inner, IReadOnlyList<(long Offset, long Size)> chunks) : Stream
{
    private int _chunk;
    private long _inChunk;

    public override bool CanRead => true;

    public override bool CanSeek => false;

    public override bool CanWrite => false;

    public override long Length => throw new NotSupportedException();

    public override long Position { get => throw new NotSupportedException(); set => throw new NotSupportedException(); }

    public override int Read(byte[] buffer, int offset, int count)
    {
        while (_chunk < chunks.Count && _inChunk >= chunks[_chunk].Size)
        {
            _chunk++;
            _inChunk = 0;
        }
        if (_chunk >= chunks.Count)
        {
            return 0;
        }
        var (start, size) = chunks[_chunk];
        inner.Position = start + _inChunk;
        int n = inner.Read(buffer, offset, (int)Math.Min(count, size - _inChunk));
        _inChunk += n;
        return n;
    }

    public override void Flush()
    {
    }

    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();

    public override void SetLength(long value) => throw new NotSupportedException();

    public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException();
}
