package steelyard.history;

import java.util.List;
import java.util.Locale;
import steelyard.io.InputException;

/**
 * Which runs a listing shows; every condition given must hold, null means "any".
 *
 * @param command    the command's name, exactly ({@code score})
 * @param dataPrefix the start of the references file's SHA-256 (any length, case-insensitive)
 * @param method     the method, exactly ({@code nbest}, {@code first})
 * @param text       text found (ASCII case-insensitive) in the command line, the label or an input's path
 */
public record RunFilter(String command, String dataPrefix, String method, String text) {
  /** Every run. */
  public static final RunFilter ALL = new RunFilter(null, null, null, null);

  public RunFilter {
    command = blankToNull(command);
    dataPrefix = dataPrefix == null || dataPrefix.isBlank() ? null : dataPrefix.trim().toLowerCase(Locale.ROOT);
    method = blankToNull(method);
    text = blankToNull(text);
  }

  /** The runs scored on the references with this SHA-256 (or prefix of it). */
  public static RunFilter data(String sha256) {
    return new RunFilter(null, sha256, null, null);
  }

  /**
   * Parses {@code KEY=VALUE} conditions, keys {@code command}, {@code data}, {@code method}, {@code text}; a later
   * value for the same key replaces an earlier one. A malformed condition is an {@link InputException} naming
   * {@code --filter}.
   */
  public static RunFilter parse(List<String> conditions) {
    String command = null;
    String data = null;
    String method = null;
    String text = null;
    for (String c : conditions) {
      int eq = c.indexOf('=');
      String key = eq < 0 ? c : c.substring(0, eq).trim();
      String value = eq < 0 ? "" : c.substring(eq + 1);
      if (eq < 0 || value.isBlank())
        throw InputException.option("--filter", "'" + c + "' has no value", "KEY=VALUE with KEY one of command, data, method, text");
      switch (key) {
        case "command": command = value; break;
        case "data": data = value; break;
        case "method": method = value; break;
        case "text": text = value; break;
        default:
          throw InputException.option("--filter", "unknown key '" + key + "'", "command, data, method or text");
      }
    }
    return new RunFilter(command, data, method, text);
  }

  private static String blankToNull(String s) {
    return s == null || s.isBlank() ? null : s;
  }
}
