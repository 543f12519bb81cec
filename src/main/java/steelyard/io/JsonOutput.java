package steelyard.io;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.Writer;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.nio.file.Path;
import java.util.Collection;

/**
 * The one JSON set-up of every output (summaries, reports, weights files): keys in insertion order (build with
 * {@link #object()}), two-space indentation of objects and arrays, LF line ends on every platform, decimals
 * written plain (never in exponent form), a final newline. Numbers that must have fixed digits are added as
 * {@link BigDecimal} values from {@link #fixed} or {@link #significant}.
 *
 * <p>{@code {@code JsonOutput.write(target, JsonOutput.object().put("utterances", 300), spec.commandLine().getOut())}}
 *
 * <p>Thread-safe: the mapper is shared, a pretty printer is made per document.
 */
public final class JsonOutput {
  private static final ObjectMapper MAPPER = new ObjectMapper()
      .disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET)
      .enable(JsonGenerator.Feature.WRITE_BIGDECIMAL_AS_PLAIN);

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

  /** {@code v} rounded half-even to exactly {@code decimals} decimals (written plain); null when not finite. */
  public static BigDecimal fixed(double v, int decimals) {
    if (!Double.isFinite(v)) return null;
    BigDecimal d = new BigDecimal(v).setScale(decimals, RoundingMode.HALF_EVEN);
    return d.signum() == 0 ? BigDecimal.ZERO.setScale(decimals) : d;
  }

  /** {@code v} to {@code digits} significant digits (plain form, e.g. a small p-value); null when not finite. */
  public static BigDecimal significant(double v, int digits) {
    if (!Double.isFinite(v)) return null;
    if (v == 0) return BigDecimal.ZERO;
    return new BigDecimal(v).round(new MathContext(digits, RoundingMode.HALF_EVEN)).stripTrailingZeros();
  }

  /** A fresh pretty printer of this layout, for streaming writers ({@link JsonGenerator#setPrettyPrinter}). */
  public static DefaultPrettyPrinter prettyPrinter() {
    DefaultIndenter indenter = new DefaultIndenter("  ", "\n");
    return new DefaultPrettyPrinter().withObjectIndenter(indenter).withArrayIndenter(indenter);
  }

  /** Any value Jackson can serialise (maps, lists, records, arrays) as a tree in this set-up. */
  public static JsonNode tree(Object value) {
    return MAPPER.valueToTree(value);
  }

  /** The rendered document, ending with a newline. */
  public static String render(JsonNode node) {
    try {
      return MAPPER.writer(prettyPrinter()).writeValueAsString(node) + "\n";
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("JSON rendering failed", e);
    }
  }

  /** A JSON text parsed into a tree (for embedding one rendered document in another). */
  public static JsonNode parse(String json) {
    try {
      return MAPPER.readTree(json);
    } catch (JsonProcessingException e) {
      throw new IllegalArgumentException("not JSON: " + e.getOriginalMessage(), e);
    }
  }

  /** Writes the document atomically to {@code target}; {@code -} writes to the process's stdout. */
  public static void write(Path target, JsonNode node) {
    String text = render(node);
    AtomicOutput.writeText(target, out -> out.write(text));
  }

  /** Writes the document atomically to {@code target}; {@code -} writes to {@code stdout}. */
  public static void write(Path target, JsonNode node, Writer stdout) {
    String text = render(node);
    AtomicOutput.writeText(target, stdout, out -> out.write(text));
  }
}
