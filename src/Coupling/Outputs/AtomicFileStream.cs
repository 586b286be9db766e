namespace Coupling.Outputs;

/// <summary>
/// A write-only stream to a temporary file that <see cref="Commit"/> renames into place; made by
/// <see cref="AtomicFile.Create"/>. Disposing it without a commit (for example when an exception leaves the
/// writing code) deletes the temporary file, so nothing is left behind.
/// </summary>
public sealed class AtomicFileStream : Stream
{
    private readonly FileStream _inner;
    private bool _closed;

    internal AtomicFileStream(FileStream inner, string temporaryPath, string targetPath)
    {
        _inner = inner;
        TemporaryPath = temporaryPath;
        TargetPath = targetPath;
    }

    /// <summary>Full path of the temporary file being written.</summary>
    public string TemporaryPath { get; }

    /// <summary>Full path the file gets on <see cref="Commit"/>.</summary>
    public string TargetPath { get; }

    /// <summary>Whether <see cref="Commit"/> has put the file in place.</summary>
    public bool IsCommitted { get; private set; }

    /// <summary>
    /// Flushes the data to disk, closes the temporary file and renames it over <see cref="TargetPath"/>
    /// (replacing an existing file). On failure the temporary file is deleted and the exception passes on.
    /// </summary>
    /// <exception cref="ObjectDisposedException">The stream was already committed or disposed.</exception>
    public void Commit()
    {
        ObjectDisposedException.ThrowIf(_closed, this);
        try
        {
            _inner.Flush(flushToDisk: true);
            _inner.Dispose();
            _closed = true;
            File.Move(TemporaryPath, TargetPath, overwrite: true);
            IsCommitted = true;
        }
        catch
        {
            Discard();
            throw;
        }
    }

    /// <inheritdoc/>
    protected override void Dispose(bool disposing)
    {
        if (disposing && !IsCommitted) Discard();
        base.Dispose(disposing);
    }

    private void Discard()
    {
        if (!_closed)
        {
            _inner.Dispose();
            _closed = true;
        }
        try { File.Delete(TemporaryPath); }
        catch (IOException) { /* best effort: the target is untouched either way */ }
        catch (UnauthorizedAccessException) { }
    }

    /// <inheritdoc/>
    public override bool CanRead => false;

    /// <inheritdoc/>
    public override bool CanSeek => !_closed && _inner.CanSeek;

    /// <inheritdoc/>
    public override bool CanWrite => !_closed;

    /// <inheritdoc/>
    public override long Length => _inner.Length;

    /// <inheritdoc/>
    public override long Position { get => _inner.Position; set => _inner.Position = value; }

    /// <inheritdoc/>
    public override void Flush() => _inner.Flush();

    /// <inheritdoc/>
    public override Task FlushAsync(CancellationToken cancellationToken) => _inner.FlushAsync(cancellationToken);

    /// <inheritdoc/>
    public override int Read(byte[] buffer, int offset, int count) => throw new NotSupportedException();

    /// <inheritdoc/>
    public override long Seek(long offset, SeekOrigin origin) => _inner.Seek(offset, origin);

    /// <inheritdoc/>
    public override void SetLength(long value) => _inner.SetLength(value);

    /// <inheritdoc/>
    public override void Write(byte[] buffer, int offset, int count) => _inner.Write(buffer, offset, count);

    /// <inheritdoc/>
    public override void Write(ReadOnlySpan<byte> buffer) => _inner.Write(buffer);

    /// <inheritdoc/>
    public override void WriteByte(byte value) => _inner.WriteByte(value);

    /// <inheritdoc/>
    public override Task WriteAsync(byte[] buffer, int offset, int count, CancellationToken cancellationToken) =>
        _inner.WriteAsync(buffer, offset, count, cancellationToken);

    /// <inheritdoc/>
    public override ValueTask WriteAsync(ReadOnlyMemory<byte> buffer, CancellationToken cancellationToken = default) =>
        _inner.WriteAsync(buffer, cancellationToken);
}
