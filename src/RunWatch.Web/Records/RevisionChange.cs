namespace RunWatch.Web.Records;

/// <summary>One figure of two report revisions side by side.</summary>
/// <param name="Figure">What it is ("mean radius", "rule: radius CV", "input images"...).</param>
/// <param name="Before">Its value in the earlier revision, formatted.</param>
/// <param name="After">Its value in the later revision, formatted.</param>
/// <param name="Changed">Whether the two differ as shown.</param>
public sealed record RevisionChange(string Figure, string Before, string After, bool Changed);
