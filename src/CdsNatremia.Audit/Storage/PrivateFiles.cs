namespace CdsNatremia.Audit.Storage;

/// <summary>
/// Owner-only permissions for what the audit keeps on disk: the data folder 0700, the pseudonym key and the SQLite
/// files (database, write-ahead log, shared memory) 0600. Other local users read none of it. On Windows the folder
/// inherits its ACL and nothing is changed here.
/// </summary>
public static class PrivateFiles
{
    /// <summary>rwx for the owner only.</summary>
    public const UnixFileMode FolderMode = UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute;

    /// <summary>rw for the owner only.</summary>
    public const UnixFileMode FileMode = UnixFileMode.UserRead | UnixFileMode.UserWrite;

    /// <summary>Creates the folder with mode 0700, or takes group and other permissions away from an existing one.</summary>
    public static void EnsureFolder(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        if (OperatingSystem.IsWindows())
        {
            Directory.CreateDirectory(path);
            return;
        }

        if (!Directory.Exists(path))
        {
            Directory.CreateDirectory(path, FolderMode);
        }

        Restrict(path, FolderMode);
    }

    /// <summary>Takes group and other permissions away from a file, when it exists (0600 or narrower).</summary>
    public static void RestrictFile(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        if (!OperatingSystem.IsWindows() && File.Exists(path))
        {
            Restrict(path, FileMode);
        }
    }

    /// <summary>Creates an empty file with mode 0600 unless it exists, then restricts it.</summary>
    public static void EnsureFile(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        if (!File.Exists(path))
        {
            var options = new FileStreamOptions { Mode = System.IO.FileMode.OpenOrCreate, Access = FileAccess.Write };
            if (!OperatingSystem.IsWindows())
            {
                options.UnixCreateMode = FileMode;
            }

            using (new FileStream(path, options))
            {
            }
        }

        RestrictFile(path);
    }

    private static void Restrict(string path, UnixFileMode allowed)
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        var mode = File.GetUnixFileMode(path);
        if ((mode & ~allowed) != 0)
        {
            File.SetUnixFileMode(path, mode & allowed);
        }
    }
}
