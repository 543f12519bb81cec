package steelyard.cli;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintStream;
import java.io.Writer;
import java.util.Locale;
import steelyard.eval.EditCounts;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSummary;

/** Output helpers of {@code rescore}: JSON writing, the stderr summary. */
final class RescoreSupport {
  private static final ObjectMapper MAPPER = new ObjectMapper()
      .disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET)
      .enable(JsonGenerator.Feature.WRITE_BIGDECIMAL_AS_PLAIN);

  private RescoreSupport() {}

  static JsonNode parse(String json) throws IOException {
    return MAPPER.readTree(json);
  }

  /** Pretty JSON with LF line ends and a final newline (same bytes on every platform). */
  static void writeJson(Writer w, JsonNode node) throws IOException {
    DefaultPrettyPrinter pp = new DefaultPrettyPrinter()
        .withObjectIndenter(new DefaultIndenter("  ", "\n"))
        .withArrayIndenter(new DefaultIndenter("  ", "\n"));
    MAPPER.writer(pp).writeValue(w, node);
    w.write('\n');
  }

  static void printSummary(PrintStream err, RescoreSummary s, RescoreMethod method, boolean withReferences) {
    err.printf(Locale.ROOT, "steelyard rescore: %d utterances by %s; %d choices differ from rank 1%s%s%n",
        s.utterances(), method.label(), s.changed(),
        s.newTranscripts() > 0 ? ", " + s.newTranscripts() + " are new transcripts" : "",
        s.cappedUtterances() > 0 ? "; the hypothesis cap applied in " + s.cappedUtterances() : "");
    if (withReferences) {
      err.printf(Locale.ROOT, "  error rate %s (rank 1 %s, N-best oracle %s) over %d utterances%n",
          percent(s.chosen()), percent(s.first()), percent(s.oracle()), s.scored());
    }
    err.println("  note: " + RescoreSummary.NOTICE);
  }

  private static String percent(EditCounts c) {
    return c.referenceTokens() == 0 ? "n/a" : String.format(Locale.ROOT, "%.2f %%", 100.0 * c.errors() / c.referenceTokens());
  }
}
