namespace RunWatch.Web.Security;

/// <summary>A demo user's name, role and freshly generated password, to print at demo start.</summary>
public sealed record DemoCredential(string Name, string Role, string Password);
