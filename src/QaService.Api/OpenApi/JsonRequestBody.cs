namespace QaService.Api.OpenApi;

/// <summary>
/// Endpoint metadata: the handler reads this JSON body itself (to point at bad fields), so the
/// OpenAPI document is told the body's type here. Unlike <c>Accepts</c>, it adds no content-type
/// constraint to routing, which would answer 415 before the handler could explain itself.
/// </summary>
internal sealed record JsonRequestBody(Type BodyType);
