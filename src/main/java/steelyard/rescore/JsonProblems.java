package steelyard.rescore;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.io.JsonEOFException;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import steelyard.io.Messages;

/**
 * Puts a JSON parser's complaint in the project's words for a one-line message: the problem and the
 * offending token stay, the parser's internals (character codes, source descriptions, feature names) go.
 * The location is taken from the exception separately.
 */
final class JsonProblems {
  private static final Pattern DUPLICATE = Pattern.compile("^Duplicate field '(.*)'$", Pattern.DOTALL);
  private static final Pattern NON_STANDARD = Pattern.compile("^Non-standard token '([^']*)'.*", Pattern.DOTALL);
  private static final Pattern CONTROL = Pattern.compile("\\(\\(CTRL-CHAR, code (\\d+)\\)\\)");
  private static final Pattern CODE = Pattern.compile("\\s*\\(code \\d+( / 0x[0-9a-fA-F]+)?\\)");
  private static final Pattern SOURCE = Pattern.compile("\\s*\\((for \\w+ starting at|start marker at) \\[Source:.*$", Pattern.DOTALL);
  private static final Pattern BACKTICKED = Pattern.compile("\\s*`[^`]*`");
  private static final int MAX_CHARS = 160;

  private JsonProblems() {}

  /** The problem, e.g. {@code key 'lm_weight' appears twice in one object} or {@code not valid JSON (…)}. */
  static String describe(JsonProcessingException e) {
    String m = e.getOriginalMessage() == null ? "" : e.getOriginalMessage();
    Matcher d = DUPLICATE.matcher(m);
    if (d.matches()) return "key '" + Messages.shown(d.group(1), 40) + "' appears twice in one object";
    if (e instanceof JsonEOFException || m.startsWith("Unexpected end-of-input")) return "the JSON text ends early (is the file truncated?)";
    Matcher n = NON_STANDARD.matcher(m);
    if (n.matches()) return "not valid JSON ('" + Messages.shown(n.group(1), 40) + "' is not a JSON number)";
    String clean = CONTROL.matcher(m).replaceAll(m2 -> "(control character U+" + String.format(Locale.ROOT, "%04X", Integer.parseInt(m2.group(1))) + ")");
    clean = SOURCE.matcher(clean).replaceAll("");
    clean = CODE.matcher(clean).replaceAll("");
    clean = BACKTICKED.matcher(clean).replaceAll("");
    clean = clean.split("\n", 2)[0].strip();
    if (clean.isEmpty()) return "not valid JSON";
    clean = Character.toLowerCase(clean.charAt(0)) + clean.substring(1);
    return "not valid JSON (" + Messages.shown(clean, MAX_CHARS) + ")";
  }

  /** What would have been accepted. */
  static String expected(JsonProcessingException e) {
    String m = e.getOriginalMessage() == null ? "" : e.getOriginalMessage();
    return DUPLICATE.matcher(m).matches() ? "each key at most once per object" : "a JSON weights file";
  }
}
