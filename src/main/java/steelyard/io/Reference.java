package steelyard.io;

/**
 * One reference (true) transcript.
 *
 * @param uttId utterance or text-line id, never empty
 * @param text  the raw reference text as in the file (may be empty: then every hypothesis token is an insertion)
 * @param group optional breakdown group (speaker, channel, document); empty string when absent
 * @param line  1-based line of the row in its file, for messages
 */
public record Reference(String uttId, String text, String group, long line) {}
