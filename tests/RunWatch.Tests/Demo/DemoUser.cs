namespace RunWatch.Tests.Demo;

/// <summary>A demo user as <c>runwatch demo</c> prints it at start.</summary>
public sealed record DemoUser(string Name, string Role, string Password);
