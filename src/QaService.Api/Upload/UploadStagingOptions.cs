using System.ComponentModel.DataAnnotations;

namespace QaService.Api.Upload;

/// <summary>How the guided upload keeps files between its preview and its run (configuration section <c>Uploads</c>).</summary>
public sealed class UploadStagingOptions
{
    public const string Section = "Uploads";

    /// <summary>Largest staged file, bytes (each side); a larger one is refused with 413. Default 32 MiB.</summary>
    [Range(1, 1_073_741_824)]
    public long MaxStagedFileBytes { get; set; } = 32L * 1024 * 1024;

    /// <summary>Minutes a staged upload is kept; after that its preview and run answer 410 and the row is removed. Default 60.</summary>
    [Range(1, 10_080)]
    public int StagingMinutes { get; set; } = 60;
}
