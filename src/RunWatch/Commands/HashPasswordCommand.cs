using System.CommandLine;
using RunWatch.Web.Security;

namespace RunWatch.Commands;

/// <summary><c>runwatch hash-password</c>: reads a password from standard input and prints the hash for RunWatch:Dashboard:Users.</summary>
internal static class HashPasswordCommand
{
    public static Command Create()
    {
        var command = new Command("hash-password",
            "Read a password from standard input (one line) and print its hash for the configuration's RunWatch:Dashboard:Users list.");
        command.SetAction(_ =>
        {
            string? password = Console.In.ReadLine();
            if (string.IsNullOrEmpty(password) || password.Length < 10)
            {
                Console.Error.WriteLine("Give a password of at least 10 characters on standard input.");
                return 2;
            }
            Console.WriteLine(new UserDirectory().HashPassword(password));
            return 0;
        });
        return command;
    }
}
