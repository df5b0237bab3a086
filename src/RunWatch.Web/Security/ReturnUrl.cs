namespace RunWatch.Web.Security;

/// <summary>The login form's return address: a path on this server, nothing else.</summary>
internal static class ReturnUrl
{
    /// <summary>
    /// True for a local path: starts with one <c>/</c> (not <c>//</c> or <c>/\</c>, which browsers read as another
    /// host), no backslash, no control or whitespace character (a header cannot carry them), at most 2048 characters.
    /// </summary>
    public static bool IsLocalPath(string value)
    {
        ArgumentNullException.ThrowIfNull(value);
        if (value.Length is 0 or > 2048 || value[0] != '/' || (value.Length > 1 && value[1] is '/' or '\\'))
        {
            return false;
        }
        foreach (char c in value)
        {
            if (char.IsControl(c) || char.IsWhiteSpace(c) || c == '\\' || char.IsSurrogate(c) || c > '\u007e')
            {
                return false;
            }
        }
        return true;
    }
}
