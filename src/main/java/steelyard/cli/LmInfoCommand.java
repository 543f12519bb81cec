package steelyard.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.JsonOutput;
import steelyard.io.OutputSet;
import steelyard.lm.CompactModel;
import steelyard.lm.ModelFiles;
import steelyard.lm.ModelMetadata;
import steelyard.lm.train.Smoothing;
import steelyard.text.NormalisationOptions;

/**
 * {@code lm describe}: what a model file holds (file format, tokens and normalisation, vocabulary and how
 * out-of-vocabulary tokens score, smoothing and minimum counts when recorded, n-grams per order, memory in the
 * query engine) and its metadata lines, as text or JSON.
 */
@Command(name = "describe", mixinStandardHelpOptions = true,
    description = "Describe a model: file format, tokens and normalisation, vocabulary, n-grams per order, training settings recorded in it, memory when loaded.")
public final class LmInfoCommand implements Callable<Integer> {
  @Spec picocli.CommandLine.Model.CommandSpec spec;
  @Mixin LmModelInput input;

  @Mixin JsonOutputOption json;

  @Override
  public Integer call() {
    input.require();
    OutputSet outputs = OutputSet.open(java.util.Collections.singletonMap("--json", json.file), java.util.List.of(input.lm));
    CompactModel lm = input.load(spec.commandLine().getErr());
    ObjectNode o = describe(lm, input.lm);
    if (json.file != null) {
      json.write(o, spec.commandLine().getOut());
      outputs.commit();
      if (json.toStdout()) return 0;
    }
    spec.commandLine().getOut().print(text(lm, o));
    spec.commandLine().getOut().flush();
    return 0;
  }

  /** The text form: a few labelled lines, a table of the orders, then the metadata lines as stored. */
  private static String text(CompactModel lm, ObjectNode o) {
    StringBuilder sb = new StringBuilder();
    sb.append(o.get("model").asText()).append("  (").append(FORMAT_NAMES.get(o.get("file_format").asText())).append(")\n");
    line(sb, "tokens", o.get("unit").asText() + "s, normalisation " + describe(lm.normalisation()));
    line(sb, "vocabulary", lm.vocabularySize() + " token ids, counting <s>, </s> and <unk>; " + (lm.hasUnknownUnigram()
        ? "out-of-vocabulary tokens score as <unk>"
        : "<unk> has no probability of its own, so out-of-vocabulary tokens score log10 P = " + lm.unknownFloorLog10()
            + " (--oov-log10-prob)"));
    JsonNode smoothing = o.get("smoothing");
    Smoothing method = smoothing.isNull() ? null : Smoothing.ofKey(smoothing.asText());
    line(sb, "smoothing", smoothing.isNull() ? "not recorded in the file"
        : method == null ? smoothing.asText() : method.key() + " (" + method.title() + ")");
    sb.append('\n').append(String.format(Locale.ROOT, "  %5s  %12s  %s%n", "order", "n-grams", "kept when seen at least"));
    for (JsonNode k : o.get("orders")) {
      JsonNode min = k.get("min_count");
      sb.append(String.format(Locale.ROOT, "  %5d  %12d  %s%n", k.get("order").asInt(), k.get("ngrams").asLong(),
          min.isNull() ? "not recorded" : min.asInt() == 1 ? "once" : min.asInt() + " times"));
    }
    sb.append(String.format(Locale.ROOT, "  %5s  %12d%n%n", "all", o.get("ngrams_total").asLong()));
    JsonNode mem = o.get("memory");
    line(sb, "memory", String.format(Locale.ROOT, "%d bytes of n-gram tables when loaded (%.2f per n-gram), %d with the vocabulary",
        mem.get("ngram_table_bytes").asLong(), mem.get("bytes_per_ngram").asDouble(), mem.get("with_vocabulary_bytes").asLong()));
    sb.append("\n").append(lm.metadata().size()).append(" metadata lines, as stored:\n");
    for (String m : lm.metadata()) sb.append("  ").append(m).append('\n');
    return sb.toString();
  }

  private static void line(StringBuilder sb, String label, String value) {
    sb.append(String.format(Locale.ROOT, "  %-11s %s%n", label, value));
  }

  private static final Map<String, String> FORMAT_NAMES = Map.of(
      "arpa", "ARPA text", "arpa-gzip", "ARPA text, gzipped", "binary", "Steelyard packed binary");

  /** The JSON form; {@code min_count} and {@code smoothing} are null when the file does not record them. */
  static ObjectNode describe(CompactModel lm, Path file) {
    ObjectNode o = JsonOutput.object();
    o.put("model", file.toString());
    o.put("file_format", ModelFiles.kind(file) == ModelFiles.Kind.BINARY ? "binary"
        : file.toString().toLowerCase(Locale.ROOT).endsWith(".gz") ? "arpa-gzip" : "arpa");
    o.put("unit", lm.unit().name().toLowerCase(Locale.ROOT));
    NormalisationOptions n = lm.normalisation();
    ObjectNode norm = o.putObject("normalisation");
    norm.put("fold_case", n.foldCase());
    norm.put("strip_punct", n.stripPunctuation());
    norm.put("split_hyphens", n.splitHyphens());
    norm.put("ignore_space", n.ignoreWhitespace());
    o.put("vocabulary_size", lm.vocabularySize());
    o.put("unk_listed", lm.hasUnknownUnigram());
    if (lm.hasUnknownUnigram()) o.putNull("oov_log10_prob");
    else o.put("oov_log10_prob", lm.unknownFloorLog10());
    String smoothing = ModelMetadata.value(lm.metadata(), "steelyard.smoothing");
    if (smoothing == null) o.putNull("smoothing");
    else o.put("smoothing", smoothing);
    o.put("order", lm.order());
    int[] minCounts = ModelMetadata.minCounts(lm.metadata(), lm.order());
    ArrayNode orders = o.putArray("orders");
    long total = 0;
    for (int k = 1; k <= lm.order(); k++) {
      ObjectNode row = orders.addObject();
      row.put("order", k);
      row.put("ngrams", lm.ngramCount(k));
      if (minCounts == null) row.putNull("min_count");
      else row.put("min_count", minCounts[k - 1]);
      total += lm.ngramCount(k);
    }
    o.put("ngrams_total", total);
    ObjectNode mem = o.putObject("memory");
    mem.put("ngram_table_bytes", lm.ngramBytesUsed());
    mem.put("with_vocabulary_bytes", lm.ramBytesUsed());
    mem.put("bytes_per_ngram", Math.round(lm.bytesPerNgram() * 100) / 100.0);
    ArrayNode meta = o.putArray("metadata");
    lm.metadata().forEach(meta::add);
    return o;
  }

  /** The normaliser's own one-line description, e.g. {@code nfkc fold-case}. */
  static String describe(NormalisationOptions n) {
    return steelyard.text.Normaliser.create(new NormalisationOptions(n.foldCase(), n.stripPunctuation(), n.splitHyphens(), n.ignoreWhitespace(), null)).describe();
  }
}
