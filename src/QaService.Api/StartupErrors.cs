using System.ComponentModel.DataAnnotations;
using System.Reflection;
using System.Text.RegularExpressions;
using Microsoft.Extensions.Options;

namespace QaService.Api;

/// <summary>
/// A bad setting stops the service with one line naming the key and a non-zero exit code, not a stack trace.
/// Only when this assembly is the process (<c>dotnet QaService.Api.dll</c>): hosted in a test process the exception
/// goes on to the host's caller, as before.
/// </summary>
internal static partial class StartupErrors
{
    /// <summary>Exit code of a configuration error (EX_CONFIG in BSD sysexits.h).</summary>
    public const int ConfigurationExitCode = 78;

    /// <summary>
    /// A configuration error that escapes Main (unhandled) prints its one line and exits with
    /// <see cref="ConfigurationExitCode"/> before the runtime would print the exception and its stack.
    /// </summary>
    public static void ExitOnConfigurationError() => AppDomain.CurrentDomain.UnhandledException += (_, unhandled) =>
    {
        if (unhandled.ExceptionObject is Exception fault && Describe(fault) is { } line)
        {
            Console.Error.WriteLine(line);
            Environment.Exit(ConfigurationExitCode);
        }
    };

    /// <summary>Runs the options' start-up checks now, before the host starts (and before it logs its own failure).</summary>
    public static void ValidateConfiguration(this WebApplication app) => app.Services.GetService<IStartupValidator>()?.Validate();

    /// <summary>The one line to print, or null when <paramref name="fault"/> is no configuration error or tests host the service.</summary>
    public static string? Describe(Exception fault)
    {
        if (Assembly.GetEntryAssembly() != typeof(StartupErrors).Assembly)
            return null;
        var messages = fault switch
        {
            OptionsValidationException options => options.Failures.Select(ErrorOnly),
            AggregateException { InnerExceptions: var inner } when inner.All(e => e is OptionsValidationException) =>
                inner.Cast<OptionsValidationException>().SelectMany(e => e.Failures).Select(ErrorOnly),
            ValidationException validation => [validation.Message],
            // The configuration binder: "Failed to convert configuration value at 'Storage:RetentionDays' to type ...".
            InvalidOperationException { Message: var message } when message.StartsWith("Failed to convert configuration value", StringComparison.Ordinal) => [message],
            _ => null,
        };
        return messages is null ? null : "QaService did not start: configuration error: " + string.Join("; ", messages).ReplaceLineEndings(" ");
    }

    /// <summary>Data annotations wrap each message ("DataAnnotation validation failed for 'X' members: 'Y' with the error: '…'."); keep the message.</summary>
    private static string ErrorOnly(string failure) => WrappedError().Match(failure) is { Success: true } match ? match.Groups[1].Value : failure;

    [GeneratedRegex(@"with the error: '(.*)'\.?$", RegexOptions.Singleline)]
    private static partial Regex WrappedError();
}
