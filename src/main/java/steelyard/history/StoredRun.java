package steelyard.history;

/**
 * A run read back from a history file.
 *
 * @param id  its id in that file
 * @param run everything recorded about it
 */
public record StoredRun(long id, RunRecord run) {}
