using System.Text.RegularExpressions;

namespace RunWatch.Wafers.Intake;

/// <summary>
/// Finds the wafer an SEM field belongs to: the sidecar's wafer id wins; otherwise a configurable regular
/// expression with a named group <c>wafer</c> applied to the file name. No match means the field waits for a
/// person to assign it.
/// </summary>
internal sealed class WaferIdResolver
{
    /// <summary>Default pattern: ids such as W-0412-A anywhere in the name (invented convention, configurable).</summary>
    public const string DefaultPattern = @"(?<wafer>W-[0-9A-Za-z]+(?:-[0-9A-Za-z]+)?)";

    private readonly Regex _pattern;

    public WaferIdResolver(string pattern)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(pattern);
        _pattern = new Regex(pattern, RegexOptions.CultureInvariant, TimeSpan.FromMilliseconds(100));
        if (Array.IndexOf(_pattern.GetGroupNames(), "wafer") < 0)
        {
            throw new ArgumentException("the file-name pattern needs a named group 'wafer', e.g. (?<wafer>W-[0-9]+)", nameof(pattern));
        }
    }

    /// <summary>Returns the wafer id, or null when the field is unassigned.</summary>
    public string? Resolve(string fileName, string? sidecarWaferId)
    {
        if (!string.IsNullOrWhiteSpace(sidecarWaferId))
        {
            return IsPlausibleId(sidecarWaferId) ? sidecarWaferId.Trim() : null;
        }
        string stem = Path.GetFileNameWithoutExtension(fileName);
        Match match;
        try
        {
            match = _pattern.Match(stem);
        }
        catch (RegexMatchTimeoutException)
        {
            return null;
        }
        return match.Success && IsPlausibleId(match.Groups["wafer"].Value) ? match.Groups["wafer"].Value : null;
    }

    /// <summary>Wafer ids are short printable tokens; anything else is treated as no id at all.</summary>
    public static bool IsPlausibleId(string id)
    {
        string t = id.Trim();
        if (t.Length is 0 or > 64)
        {
            return false;
        }
        foreach (char c in t)
        {
            if (!(char.IsAsciiLetterOrDigit(c) || c is '-' or '_' or '.'))
            {
                return false;
            }
        }
        return true;
    }
}
