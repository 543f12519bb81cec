package steelyard.report;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Path;
import java.util.Collection;
import steelyard.io.AtomicOutput;

/**
 * The one JSON set-up for every report: keys in insertion order (build with {@link #object()}), two-space
 * indentation, LF line ends on every platform, decimals written plain (never in exponent form), a final
 * newline. Numbers should be added as {@link Numbers#decimal} values so their digits are fixed.
 */
public final class JsonOutput {
  private static final ObjectMapper MAPPER = new ObjectMapper().enable(JsonGenerator.Feature.WRITE_BIGDECIMAL_AS_PLAIN);
  private static final DefaultPrettyPrinter PRETTY;

  static {
    DefaultIndenter indenter = new DefaultIndenter("  ", "\n");
    DefaultPrettyPrinter p = new DefaultPrettyPrinter();
    p.indentObjectsWith(indenter);
    p.indentArraysWith(indenter);
    PRETTY = p;
  }

  private JsonOutput() {}

  /** A new empty object whose keys keep the order they are put in. */
  public static ObjectNode object() {
    return MAPPER.createObjectNode();
  }

  /** A new empty array. */
  public static ArrayNode array() {
    return MAPPER.createArrayNode();
  }

  /** An array of strings in the given order. */
  public static ArrayNode strings(Collection<String> values) {
    ArrayNode a = array();
    values.forEach(a::add);
    return a;
  }

  /** The rendered document, ending with a newline. */
  public static String render(JsonNode node) {
    try {
      return MAPPER.writer(PRETTY).writeValueAsString(node) + "\n";
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("JSON rendering failed", e);
    }
  }

  /** Writes the document atomically to {@code target} ({@code -} for stdout). */
  public static void write(Path target, JsonNode node) {
    String text = render(node);
    AtomicOutput.writeText(target, out -> out.write(text));
  }
}
