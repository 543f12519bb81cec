package steelyard.io;

/** A row that lenient mode ({@code --max-bad-rows N}) skipped: where it was and why. */
public record SkippedRow(String file, long line, String reason) {}
