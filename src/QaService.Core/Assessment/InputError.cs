namespace QaService.Core.Assessment;

/// <summary>One problem with a request, located by an RFC 6901 JSON pointer into the request body.</summary>
/// <param name="Pointer">e.g. <c>/fixes/points/17/lat</c>.</param>
/// <param name="Message">What is wrong and what would be right.</param>
public sealed record InputError(string Pointer, string Message);
