package steelyard.cli;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.JsonOutput;
import steelyard.lm.CompactModel;
import steelyard.lm.ModelFiles;
import steelyard.text.NormalisationOptions;

/** Describe a model: orders, counts, vocabulary, normalisation, bytes per n-gram. */
@Command(name = "info", mixinStandardHelpOptions = true, description = "Describe a model: orders, counts, vocabulary, normalisation, bytes per n-gram.")
public final class LmInfoCommand implements Callable<Integer> {
  @Spec picocli.CommandLine.Model.CommandSpec spec;
  @Mixin LmModelInput input;

  @Option(names = "--json", paramLabel = "FILE", description = "Also write the description as JSON to FILE ('-' = stdout, instead of the text form).")
  Path json;

  @Override
  public Integer call() {
    if (json != null) steelyard.io.AtomicOutput.refuseOverwritingInput(json, input.lm);
    CompactModel lm = input.load(spec.commandLine().getErr());
    ObjectNode o = describe(lm, input.lm);
    if (json != null) {
      JsonOutput.write(json, o, spec.commandLine().getOut());
      if (json.toString().equals("-")) return 0;
    }
    StringBuilder sb = new StringBuilder();
    sb.append("model            ").append(input.lm).append('\n');
    sb.append("format           ").append(o.get("format").asText()).append('\n');
    sb.append("order            ").append(lm.order()).append('\n');
    for (int k = 1; k <= lm.order(); k++) sb.append(String.format(Locale.ROOT, "%d-grams          %d%n", k, lm.ngramCount(k)));
    sb.append("vocabulary       ").append(lm.vocabularySize()).append(" tokens (with <s>, </s>, <unk>)\n");
    sb.append("has <unk>        ").append(lm.hasUnknownUnigram() ? "yes" : "no (closed vocabulary: out-of-vocabulary log10 P = " + lm.unknownFloorLog10() + ")").append('\n');
    sb.append("unit             ").append(o.get("unit").asText()).append('\n');
    sb.append("normalisation    ").append(describe(lm.normalisation())).append('\n');
    sb.append(String.format(Locale.ROOT, "bytes per n-gram %.2f (n-gram arrays %d bytes, with vocabulary %d bytes)%n",
        lm.bytesPerNgram(), lm.ngramBytesUsed(), lm.ramBytesUsed()));
    for (String m : lm.metadata()) sb.append("metadata         ").append(m).append('\n');
    spec.commandLine().getOut().print(sb);
    spec.commandLine().getOut().flush();
    return 0;
  }

  static ObjectNode describe(CompactModel lm, Path file) {
    ObjectNode o = JsonOutput.object();
    o.put("model", file.toString());
    o.put("format", ModelFiles.kind(file) == ModelFiles.Kind.BINARY ? "binary" : "arpa");
    o.put("order", lm.order());
    ArrayNode counts = o.putArray("ngram_counts");
    long total = 0;
    for (int k = 1; k <= lm.order(); k++) {
      counts.add(lm.ngramCount(k));
      total += lm.ngramCount(k);
    }
    o.put("ngrams", total);
    o.put("vocabulary_size", lm.vocabularySize());
    o.put("has_unk", lm.hasUnknownUnigram());
    o.put("unk_floor_log10", lm.unknownFloorLog10());
    o.put("unit", lm.unit().name().toLowerCase(Locale.ROOT));
    NormalisationOptions n = lm.normalisation();
    ObjectNode norm = o.putObject("normalisation");
    norm.put("fold_case", n.foldCase());
    norm.put("strip_punct", n.stripPunctuation());
    norm.put("split_hyphens", n.splitHyphens());
    norm.put("ignore_space", n.ignoreWhitespace());
    o.put("bytes_per_ngram", Math.round(lm.bytesPerNgram() * 100) / 100.0);
    o.put("ngram_bytes", lm.ngramBytesUsed());
    o.put("ram_bytes", lm.ramBytesUsed());
    ArrayNode meta = o.putArray("metadata");
    lm.metadata().forEach(meta::add);
    return o;
  }

  /** The normaliser's own one-line description, e.g. {@code nfkc fold-case}. */
  static String describe(NormalisationOptions n) {
    return steelyard.text.Normaliser.create(new NormalisationOptions(n.foldCase(), n.stripPunctuation(), n.splitHyphens(), n.ignoreWhitespace(), null)).describe();
  }
}
