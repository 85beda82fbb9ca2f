# syntax=docker/dockerfile:1
# CdsNatremia service image (docs/deployment.md). Multi-stage: the SDK image builds and publishes, the ASP.NET Core
# runtime image runs it as an unprivileged user on a read-only root file system. The knowledge files (profiles/) are
# baked in; the data folder (/data) is a volume. Kept in step with deploy/kubernetes by tests/…/Deployment tests.

FROM mcr.microsoft.com/dotnet/sdk:10.0 AS build
WORKDIR /src
# Restore first, from the project files alone, so the package layer is cached until a project file changes.
COPY Directory.Build.props Directory.Packages.props ./
COPY src/CdsNatremia.Core/CdsNatremia.Core.csproj src/CdsNatremia.Core/
COPY src/CdsNatremia.Fhir/CdsNatremia.Fhir.csproj src/CdsNatremia.Fhir/
COPY src/CdsNatremia.Audit/CdsNatremia.Audit.csproj src/CdsNatremia.Audit/
COPY src/CdsNatremia.Scenarios/CdsNatremia.Scenarios.csproj src/CdsNatremia.Scenarios/
COPY src/CdsNatremia.Service/CdsNatremia.Service.csproj src/CdsNatremia.Service/
RUN dotnet restore src/CdsNatremia.Service/CdsNatremia.Service.csproj
COPY src/ src/
COPY profiles/ profiles/
RUN dotnet publish src/CdsNatremia.Service/CdsNatremia.Service.csproj -c Release --no-restore -o /app \
    && rm -rf /app/data

FROM mcr.microsoft.com/dotnet/aspnet:10.0 AS runtime
WORKDIR /app
COPY --from=build --chown=0:0 /app/ /app/
COPY --from=build --chown=0:0 /src/profiles/ /app/profiles/
# The data folder (SQLite audit, generated key in Development) is the only place the service writes, besides /tmp.
RUN mkdir -p /data && chown 10001:10001 /data && chmod 0700 /data
VOLUME ["/data"]
ENV Urls="http://+:8080;http://+:9464" \
    Natremia__KnowledgeDirectory=/app/profiles \
    Natremia__Audit__DataDirectory=/data \
    Natremia__Telemetry__MetricsPort=9464 \
    DOTNET_EnableDiagnostics=0 \
    DOTNET_NOLOGO=1
EXPOSE 8080 9464
USER 10001:10001
ENTRYPOINT ["dotnet", "/app/CdsNatremia.Service.dll"]
