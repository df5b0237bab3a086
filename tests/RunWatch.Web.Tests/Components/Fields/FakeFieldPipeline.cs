using RunWatch.Web.Data.Fields;

namespace RunWatch.Web.Tests.Components.Fields;

/// <summary>
/// Records what the screens ask of the pipeline and answers as told. The real pipeline (upload into the drop
/// folder, analysis) is tested in RunWatch.Wafers.Tests and over the real demo in the browser.
/// </summary>
internal sealed class FakeFieldPipeline : IFieldPipeline
{
    public List<(FieldUploadRequest Request, byte[] Bytes, string User)> Uploads { get; } = [];

    public List<(string Target, string Reason, string User)> Reanalyses { get; } = [];

    public List<FieldQueueEntry> Fields { get; } = [];

    public FieldUploadResult NextResult { get; set; } = new(true, "41", "W-2030-A", FieldQueueState.Queued, "queued for analysis");

    public long MaxUploadBytes { get; set; } = 1024 * 1024;

    public async Task<FieldUploadResult> UploadAsync(FieldUploadRequest request, Stream image, string user, CancellationToken cancellationToken)
    {
        using var copy = new MemoryStream();
        await image.CopyToAsync(copy, cancellationToken);
        Uploads.Add((request, copy.ToArray(), user));
        return NextResult;
    }

    public bool IsRunning(string fieldId) => Fields.Any(f => f.FieldId == fieldId && f.State == FieldQueueState.Running);

    public Task<IReadOnlyList<FieldQueueEntry>> GetRecentFieldsAsync(int maxCount, CancellationToken cancellationToken) =>
        Task.FromResult<IReadOnlyList<FieldQueueEntry>>([.. Fields.Take(maxCount)]);

    public Task<int> ReanalyseWaferAsync(string waferId, string reason, string user, CancellationToken cancellationToken)
    {
        Reanalyses.Add(("wafer " + waferId, reason, user));
        return Task.FromResult(3);
    }

    public Task ReanalyseFieldAsync(string fieldId, string reason, string user, CancellationToken cancellationToken)
    {
        if (fieldId == "404")
        {
            throw new InvalidOperationException("no field with id 404");
        }
        Reanalyses.Add(("field " + fieldId, reason, user));
        return Task.CompletedTask;
    }
}
