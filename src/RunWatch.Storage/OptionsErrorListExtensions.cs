using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;

namespace RunWatch.Storage;

/// <summary>
/// Start-up validation that reports an options section's own error list, one failure per problem, instead of one
/// generic message. Kept here because every room that binds options (Ingest, Wafers, Web) references Storage.
/// </summary>
public static class OptionsErrorListExtensions
{
    /// <summary>
    /// Validates the options with <paramref name="errors"/> (empty when valid); each error becomes one failure of the
    /// <see cref="OptionsValidationException"/> thrown at start, prefixed with <paramref name="section"/>.
    /// </summary>
    public static OptionsBuilder<TOptions> ValidateErrorList<TOptions>(this OptionsBuilder<TOptions> builder, string section, Func<TOptions, IEnumerable<string>> errors)
        where TOptions : class
    {
        ArgumentNullException.ThrowIfNull(builder);
        ArgumentNullException.ThrowIfNull(errors);
        builder.Services.AddSingleton<IValidateOptions<TOptions>>(new ErrorListValidation<TOptions>(builder.Name, section, errors));
        return builder;
    }

    private sealed class ErrorListValidation<TOptions>(string? name, string section, Func<TOptions, IEnumerable<string>> errors) : IValidateOptions<TOptions>
        where TOptions : class
    {
        public ValidateOptionsResult Validate(string? optionsName, TOptions options)
        {
            if (name is not null && name != optionsName)
            {
                return ValidateOptionsResult.Skip;
            }
            var problems = errors(options).Select(e => e.StartsWith(section, StringComparison.Ordinal) ? e : $"{section}: {e}").ToList();
            return problems.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(problems);
        }
    }
}
