package steelyard.history;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.type.TypeReference;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.List;

/**
 * How the history stores lists of strings (the command line, warnings) and times: compact JSON arrays, and UTC
 * times of fixed width ({@code 2026-12-02T10:15:30.123Z}) that sort as text.
 */
final class HistoryJson {
  private static final ObjectMapper MAPPER = new ObjectMapper();
  private static final TypeReference<List<String>> STRINGS = new TypeReference<>() {};
  private static final DateTimeFormatter TIME = DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mm:ss.SSSX").withZone(ZoneOffset.UTC);

  private HistoryJson() {}

  static String strings(List<String> values) {
    try {
      return MAPPER.writeValueAsString(values);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("a list of strings always renders as JSON", e);
    }
  }

  /** The list stored by {@link #strings}; a damaged value is an {@link IllegalArgumentException}. */
  static List<String> parseStrings(String json) {
    try {
      return List.copyOf(MAPPER.readValue(json, STRINGS));
    } catch (JsonProcessingException e) {
      throw new IllegalArgumentException("not a JSON array of strings: " + e.getOriginalMessage(), e);
    }
  }

  /** The JSON text {@code json} (a stored weights file) as a tree; a damaged value is an {@link IllegalArgumentException}. */
  static JsonNode tree(String json) {
    try {
      return MAPPER.readTree(json);
    } catch (JsonProcessingException e) {
      throw new IllegalArgumentException("not JSON: " + e.getOriginalMessage(), e);
    }
  }

  static String time(Instant t) {
    return TIME.format(t);
  }

  /**
   * Reads a stored time. The fixed form {@link #time} writes is read field by field (ten times faster than
   * {@link Instant#parse}, which dominated listing thousands of runs); any other ISO-8601 instant through
   * {@link Instant#parse}.
   */
  static Instant parseTime(String s) {
    if (s.length() != FIXED_LENGTH || !fixedForm(s)) return Instant.parse(s);
    LocalDateTime t = LocalDateTime.of(digits(s, 0, 4), digits(s, 5, 7), digits(s, 8, 10), digits(s, 11, 13), digits(s, 14, 16),
        digits(s, 17, 19), digits(s, 20, 23) * NANOS_PER_MILLI);
    return t.toInstant(ZoneOffset.UTC);
  }

  private static final int FIXED_LENGTH = "2026-12-02T10:15:30.123Z".length();
  private static final int NANOS_PER_MILLI = 1_000_000;

  // uuuu-MM-ddTHH:mm:ss.SSSZ: separators where the form puts them, ASCII digits everywhere else.
  private static boolean fixedForm(String s) {
    for (int i = 0; i < FIXED_LENGTH; i++) {
      char c = s.charAt(i);
      char want = i == 4 || i == 7 ? '-' : i == 10 ? 'T' : i == 13 || i == 16 ? ':' : i == 19 ? '.' : i == 23 ? 'Z' : '0';
      if (want == '0' ? c < '0' || c > '9' : c != want) return false;
    }
    return true;
  }

  private static int digits(String s, int from, int to) {
    int v = 0;
    for (int i = from; i < to; i++) v = v * 10 + (s.charAt(i) - '0');
    return v;
  }
}
