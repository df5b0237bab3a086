using Microsoft.Extensions.Options;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Scale;
using RunWatch.Wafers.Intake;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// Puts an uploaded SEM image (and, when given, its sidecar) into the drop folder's <c>uploads</c> subfolder under
/// its checked name and takes it in at once. The bytes are written to a hidden partial file first and moved into
/// place only when complete; an existing file is never overwritten; a refusal leaves nothing behind. Used by
/// <c>POST /api/fields/upload</c> and by the dashboard's upload form.
/// </summary>
public sealed class FieldUploader(FieldIntake intake, FieldIntakeService watcher, IOptions<IntakeOptions> options)
{
    /// <summary>Largest upload accepted, bytes (RunWatch:Intake:MaxUploadBytes).</summary>
    public long MaxBytes => options.Value.MaxUploadBytes;

    /// <summary>Stores and takes in one upload.</summary>
    /// <param name="name">The image's file name, without folders.</param>
    /// <param name="body">The image's bytes.</param>
    /// <param name="sidecar">Sidecar to write beside the image (already validated), or null for none.</param>
    /// <param name="checkImage">Decode the image before storing it, so that a file the analysis cannot read is refused at once with the decoder's reason.</param>
    /// <param name="cancellationToken">Cancels the upload; nothing is left behind.</param>
    public async Task<FieldUploadOutcome> UploadAsync(string? name, Stream body, FieldSidecar? sidecar, bool checkImage, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(body);
        if (string.IsNullOrEmpty(name) || name.Contains('/', StringComparison.Ordinal) || name.Contains('\\', StringComparison.Ordinal))
        {
            return FieldUploadOutcome.Refused(400, "give the image's file name, without folders");
        }
        if (FieldFileNameCheck.Refusal(name) is { } refusal)
        {
            return FieldUploadOutcome.Refused(400, "file name refused: " + refusal);
        }
        long limit = MaxBytes;
        string folder = Path.Combine(watcher.DropFolder, FieldFileNameCheck.UploadFolder);
        Directory.CreateDirectory(folder);
        string? path = FieldFileNameCheck.ResolveInside(folder, name);
        if (path is null)
        {
            return FieldUploadOutcome.Refused(400, "file name refused: path leaves the upload folder");
        }
        string partial = Path.Combine(folder, "." + Guid.NewGuid().ToString("N") + FieldFileNameCheck.UploadPartialSuffix);
        string? sidecarWritten = null;
        bool placed = false;
        try
        {
            long written = 0;
            await using (var output = new FileStream(partial, FileMode.CreateNew, FileAccess.Write, FileShare.None, 1 << 16, useAsync: true))
            {
                byte[] buffer = new byte[1 << 16];
                int read;
                while ((read = await body.ReadAsync(buffer, cancellationToken).ConfigureAwait(false)) > 0)
                {
                    written += read;
                    if (written > limit)
                    {
                        return FieldUploadOutcome.Refused(413, $"upload larger than {limit} bytes (RunWatch:Intake:MaxUploadBytes)");
                    }
                    await output.WriteAsync(buffer.AsMemory(0, read), cancellationToken).ConfigureAwait(false);
                }
            }
            if (written == 0)
            {
                return FieldUploadOutcome.Refused(400, "empty upload");
            }
            if (checkImage && Unreadable(partial, name) is { } unreadable)
            {
                return FieldUploadOutcome.Refused(400, "not an image the analysis can read: " + unreadable);
            }
            if (File.Exists(path) || File.Exists(FieldSidecar.PathFor(path)))
            {
                return FieldUploadOutcome.Refused(409, $"a file named {name} was uploaded before; rename the new one");
            }
            if (sidecar is not null)
            {
                // Sidecar first, image last: whoever sees the image (this intake or the folder watcher) sees its sidecar.
                string sidecarPartial = partial + FieldSidecar.Suffix;
                sidecar.WriteFor(partial);
                File.Move(sidecarPartial, FieldSidecar.PathFor(path), overwrite: false);
                sidecarWritten = FieldSidecar.PathFor(path);
            }
            try
            {
                File.Move(partial, path, overwrite: false);
                placed = true;
            }
            catch (IOException)
            {
                return FieldUploadOutcome.Refused(409, $"a file named {name} was uploaded before; rename the new one");
            }
            var info = new FileInfo(path);
            var (field, added) = await intake.TakeInAsync(
                new ArrivedField(path, Path.GetRelativePath(watcher.DropFolder, path), info.Length, info.LastWriteTimeUtc), cancellationToken).ConfigureAwait(false);
            return new FieldUploadOutcome(added ? 201 : 200, null, field, added);
        }
        finally
        {
            if (File.Exists(partial))
            {
                File.Delete(partial);
            }
            if (!placed && sidecarWritten is not null && File.Exists(sidecarWritten))
            {
                File.Delete(sidecarWritten);
            }
        }
    }

    private static string? Unreadable(string path, string name)
    {
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
            _ = GrayImageDecoder.Decode(stream, name);
            return null;
        }
        catch (ImageDecodeException ex)
        {
            return ex.Message;
        }
    }
}
