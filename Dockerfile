# Multi-stage build: the SDK image compiles; the small "chiseled" ASP.NET runtime image (no shell, no
# package manager, non-root user `app`, UID $APP_UID = 1654) runs it. This machine has no Docker engine,
# so the file is reviewed, not built here; see deploy/README.md.
FROM mcr.microsoft.com/dotnet/sdk:10.0 AS build
WORKDIR /source
COPY Directory.Build.props Directory.Packages.props QaService.sln ./
COPY src/QaService.Core/QaService.Core.csproj src/QaService.Core/
COPY src/QaService.Api/QaService.Api.csproj src/QaService.Api/
RUN dotnet restore src/QaService.Api/QaService.Api.csproj
COPY src/ src/
RUN dotnet publish src/QaService.Api/QaService.Api.csproj -c Release -o /app -p:UseAppHost=false \
    && mkdir -p /appdata

FROM mcr.microsoft.com/dotnet/aspnet:10.0-noble-chiseled AS runtime
WORKDIR /app
# The program stays root-owned (read-only to the service); only the data folder belongs to the app user.
COPY --from=build /app ./
COPY --from=build --chown=$APP_UID:$APP_UID /appdata ./data
USER $APP_UID
# appsettings.json listens on localhost:5080 (the local default); in a container listen on every
# interface. An unprefixed variable is read after appsettings.json, so it wins (ASPNETCORE_URLS would not).
ENV Urls=http://+:8080
EXPOSE 8080
# SQLite (the default) keeps reports in /app/data: mount a volume there, or set Storage__Provider=postgres.
# Probes: GET /healthz (liveness), GET /readyz (storage reachable); metrics at GET /metrics.
ENTRYPOINT ["dotnet", "QaService.Api.dll"]
