# Multi-stage build: the SDK image compiles, the ASP.NET runtime image runs as a non-root user.
FROM mcr.microsoft.com/dotnet/sdk:10.0 AS build
WORKDIR /source
COPY Directory.Build.props Directory.Packages.props QaService.sln ./
COPY src/QaService.Core/QaService.Core.csproj src/QaService.Core/
COPY src/QaService.Api/QaService.Api.csproj src/QaService.Api/
RUN dotnet restore src/QaService.Api/QaService.Api.csproj
COPY src/ src/
RUN dotnet publish src/QaService.Api/QaService.Api.csproj -c Release -o /app --no-restore

FROM mcr.microsoft.com/dotnet/aspnet:10.0 AS runtime
WORKDIR /app
COPY --from=build /app ./
# The SQLite file lives in /app/data; mount a volume there to keep reports across containers.
RUN mkdir -p /app/data && chown -R $APP_UID /app/data
USER $APP_UID
ENV ASPNETCORE_URLS=http://+:8080
EXPOSE 8080
# Probes for an orchestrator: GET /healthz (liveness) and GET /readyz (storage reachable).
ENTRYPOINT ["dotnet", "QaService.Api.dll"]
