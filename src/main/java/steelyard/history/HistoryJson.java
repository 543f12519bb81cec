package steelyard.history;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.type.TypeReference;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.time.Instant;
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

  static Instant parseTime(String s) {
    return Instant.parse(s);
  }
}
