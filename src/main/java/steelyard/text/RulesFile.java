package steelyard.text;

import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import steelyard.io.InputException;
import steelyard.io.InputFiles;

/**
 * Reader of the line-based rules file (format in the README, section "Text normalisation").
 *
 * <p>One rule per line: {@code equate CANONICAL = VARIANT | VARIANT …}, {@code optional PHRASE | PHRASE …} or
 * {@code drop PHRASE | PHRASE …}. A phrase is one or more words separated by blanks. Lines whose first
 * non-blank character is {@code #} are comments; blank lines are skipped. {@code \|}, {@code \=} and
 * {@code \\} write the separators literally. Strict UTF-8 (a leading BOM is skipped), LF or CRLF, plain
 * or gzipped ({@code .gz}). The file is read whole: rules files are small, and decoding line by line gives
 * exact line numbers for invalid bytes.
 */
public final class RulesFile {
  private RulesFile() {}

  /**
   * A rule as written, before normalisation.
   *
   * @param line      1-based line in the file
   * @param kind      what the rule does
   * @param canonical the canonical phrase of an {@code equate} rule, else null
   * @param phrases   the variants of an {@code equate} rule, or the phrases of an optional / drop rule
   * @param text      the rule line as written, trimmed (used to label usage counts)
   */
  public record Rule(int line, RuleKind kind, String canonical, List<String> phrases, String text) {
    public Rule {
      phrases = List.copyOf(phrases);
    }
  }

  /** Reads and checks the syntax of {@code file}; problems are {@link InputException}s with file:line. */
  public static List<Rule> read(Path file) {
    byte[] bytes = readBytes(file);
    List<Rule> rules = new ArrayList<>();
    CharsetDecoder utf8 = StandardCharsets.UTF_8.newDecoder()
        .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
    int start = startsWithBom(bytes) ? 3 : 0;
    int lineNo = 0;
    while (start < bytes.length) {
      lineNo++;
      int end = start;
      while (end < bytes.length && bytes[end] != '\n') end++;
      int stop = end > start && bytes[end - 1] == '\r' ? end - 1 : end;
      String line = decode(utf8, bytes, start, stop, file, lineNo);
      Rule rule = parseLine(line, file, lineNo);
      if (rule != null) rules.add(rule);
      start = end + 1;
    }
    return rules;
  }

  /** Parses the rules in {@code text} as if read from {@code file} (which need not exist). */
  public static List<Rule> parse(String text, Path file) {
    List<Rule> rules = new ArrayList<>();
    String[] lines = text.split("\r?\n", -1);
    for (int i = 0; i < lines.length; i++) {
      Rule rule = parseLine(lines[i], file, i + 1);
      if (rule != null) rules.add(rule);
    }
    return rules;
  }

  static Rule parseLine(String line, Path file, int lineNo) {
    String trimmed = line.strip();
    if (trimmed.isEmpty() || trimmed.charAt(0) == '#') return null;
    int blank = firstBlank(trimmed);
    String keyword = blank < 0 ? trimmed : trimmed.substring(0, blank);
    RuleKind kind = RuleKind.ofKeyword(keyword);
    if (kind == null)
      throw InputException.at(file, lineNo, "unknown rule '" + keyword + "'", "equate, optional or drop");
    String body = blank < 0 ? "" : trimmed.substring(blank + 1);
    List<String> parts = splitUnescaped(body, '=', file, lineNo);
    if (kind == RuleKind.EQUATE) {
      if (parts.size() != 2)
        throw InputException.at(file, lineNo,
            parts.size() == 1 ? "equate rule without '='" : "equate rule with more than one '='",
            "equate CANONICAL = VARIANT | VARIANT …");
      if (hasUnescaped(parts.get(0), '|'))
        throw InputException.at(file, lineNo, "'|' before '=' in equate rule", "one canonical form before '='");
      String canonical = unescape(parts.get(0), file, lineNo).strip();
      if (canonical.isEmpty())
        throw InputException.at(file, lineNo, "empty canonical form", "equate CANONICAL = VARIANT | VARIANT …");
      return new Rule(lineNo, kind, canonical, phrases(parts.get(1), file, lineNo, kind), trimmed);
    }
    if (parts.size() != 1)
      throw InputException.at(file, lineNo, "'=' in " + keyword + " rule", keyword + " PHRASE | PHRASE … (write \\= for a literal '=')");
    return new Rule(lineNo, kind, null, phrases(body, file, lineNo, kind), trimmed);
  }

  private static List<String> phrases(String body, Path file, int lineNo, RuleKind kind) {
    List<String> out = new ArrayList<>();
    for (String raw : splitUnescaped(body, '|', file, lineNo)) {
      String phrase = unescape(raw, file, lineNo).strip();
      if (phrase.isEmpty())
        throw InputException.at(file, lineNo, "empty phrase in " + kind.keyword() + " rule",
            "one or more words between each '|'");
      out.add(phrase);
    }
    return out;
  }

  /** Splits at {@code sep} not preceded by a backslash; escapes stay in the parts for {@link #unescape}. */
  private static List<String> splitUnescaped(String s, char sep, Path file, int lineNo) {
    List<String> parts = new ArrayList<>();
    int from = 0;
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      if (c == '\\') i++;
      else if (c == sep) {
        parts.add(s.substring(from, i));
        from = i + 1;
      }
    }
    parts.add(s.substring(from));
    return parts;
  }

  private static boolean hasUnescaped(String s, char sep) {
    for (int i = 0; i < s.length(); i++) {
      if (s.charAt(i) == '\\') i++;
      else if (s.charAt(i) == sep) return true;
    }
    return false;
  }

  private static String unescape(String s, Path file, int lineNo) {
    if (s.indexOf('\\') < 0) return s;
    StringBuilder sb = new StringBuilder(s.length());
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      if (c != '\\') {
        sb.append(c);
        continue;
      }
      char next = i + 1 < s.length() ? s.charAt(i + 1) : 0;
      if (next != '|' && next != '=' && next != '\\')
        throw InputException.at(file, lineNo,
            next == 0 ? "backslash at end of line" : "unknown escape '\\" + next + "'", "\\|, \\= or \\\\");
      sb.append(next);
      i++;
    }
    return sb.toString();
  }

  private static int firstBlank(String s) {
    for (int i = 0; i < s.length(); i++) if (CharClasses.isWhitespace(s.charAt(i))) return i;
    return -1;
  }

  private static String decode(CharsetDecoder utf8, byte[] bytes, int from, int to, Path file, int lineNo) {
    try {
      CharBuffer chars = utf8.reset().decode(ByteBuffer.wrap(bytes, from, to - from));
      return chars.toString();
    } catch (CharacterCodingException e) {
      throw InputException.at(file, lineNo, "invalid UTF-8", "a UTF-8 text file").withCause(e);
    }
  }

  private static boolean startsWithBom(byte[] b) {
    return b.length >= 3 && (b[0] & 0xFF) == 0xEF && (b[1] & 0xFF) == 0xBB && (b[2] & 0xFF) == 0xBF;
  }

  private static byte[] readBytes(Path file) {
    if (!InputFiles.isStream(file) && !Files.exists(file)) throw InputException.inFile(file, "no such rules file", "an existing readable file");
    try {
      return InputFiles.readAllBytes(file);
    } catch (InputException e) {
      if (!InputFiles.isGzipName(file)) throw e;
      throw InputException.inFile(file, "not a valid gzip file: " + e.problem(), "gzip data in a file named .gz").withCause(e);
    }
  }

}
