package steelyard.cli;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.function.Function;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.AtomicOutput;
import steelyard.io.JsonOutput;
import steelyard.io.InputException;
import steelyard.io.OutputSet;
import steelyard.io.OutputTarget;
import steelyard.lm.BackoffModel;
import steelyard.lm.LanguageModel;
import steelyard.lm.ModelFiles;
import steelyard.lm.eval.Perplexity;
import steelyard.lm.eval.PerplexityResult;
import steelyard.lm.prune.EntropyPruner;

/** Relative-entropy pruning (Stolcke 1998) with a threshold; back-off weights recomputed. */
@Command(name = "prune", mixinStandardHelpOptions = true,
    description = "Relative-entropy pruning of a back-off model: drop n-grams whose removal raises the relative "
        + "entropy by less than the threshold; back-off weights are recomputed.")
public final class LmPruneCommand implements Callable<Integer> {
  @Spec picocli.CommandLine.Model.CommandSpec spec;
  @Mixin LmModelInput input;
  @Mixin NormalisationInput normalisation;

  @Option(names = "--threshold", required = true, paramLabel = "THETA",
      description = "Relative-entropy threshold in nats (e.g. 1e-8 … 1e-6); 0 keeps everything.")
  double threshold;

  @Option(names = "--text", paramLabel = "FILE", description = "Held-out text: report the perplexity before and after.")
  Path text;

  @Option(names = "--out", required = true, paramLabel = "FILE", description = "Pruned model: .arpa, .arpa.gz or .bin.")
  Path out;

  @Mixin JsonOutputOption json;

  @Override
  public Integer call() {
    input.require();
    PrintWriter err = spec.commandLine().getErr();
    if (!(threshold >= 0) || Double.isInfinite(threshold))
      throw InputException.option("--threshold", "'" + threshold + "' is not a finite number >= 0", "a relative-entropy threshold such as 1e-7");
    Path[] inputs = text == null ? new Path[] {input.lm} : new Path[] {input.lm, text};
    OutputSet outputs = OutputSet.open(LmModelInput.outputs("--out", out, "--json", json.file), java.util.Arrays.asList(inputs));
    List<String> warnings = new ArrayList<>();
    BackoffModel model = input.loadExact(err);
    if (model.metadata().stream().anyMatch(l -> l.replace(" ", "").endsWith("smoothing=mkn"))) {
      LmModelInput.warn(err, "this is a modified Kneser-Ney model; Kneser-Ney models lose more under heavy entropy pruning "
          + "than Witten-Bell or absolute-discount models (Chelba et al. 2010): for hard pruning, train with --smoothing wb or abs");
    }
    EntropyPruner.Result r = EntropyPruner.prune(model, threshold);
    ModelFiles.save(r.model(), out, spec.commandLine().getOut());
    PerplexityResult before = null;
    PerplexityResult after = null;
    if (text != null) {
      Function<String, List<String>> tokenizer = LmModelInput.tokenizer(model, normalisation, spec.commandLine().getParseResult(), err);
      List<List<String>> sentences = new ArrayList<>();
      LmModelInput.forEachSentence(text, tokenizer, (line, tokens) -> sentences.add(tokens), LmModelInput.warnings(err, warnings));
      before = perplexity(model, sentences);
      after = perplexity(r.model(), sentences);
    }
    ObjectNode report = report(r, before, after);
    warnings.forEach(report.putArray("warnings")::add);
    json.write(report, spec.commandLine().getOut());
    outputs.commit();
    if (!json.toStdout()) printText(r, before, after);
    return 0;
  }

  private static PerplexityResult perplexity(LanguageModel lm, List<List<String>> sentences) {
    Perplexity p = new Perplexity(lm);
    long line = 0;
    for (List<String> s : sentences) p.add(++line, s);
    return p.result();
  }

  private ObjectNode report(EntropyPruner.Result r, PerplexityResult before, PerplexityResult after) {
    ObjectNode o = JsonOutput.object();
    o.put("model", input.lm.toString());
    o.put("threshold_nats", threshold);
    ArrayNode orders = o.putArray("orders");
    for (int k = 0; k < r.before().length; k++) {
      ObjectNode n = orders.addObject();
      n.put("order", k + 1);
      n.put("ngrams_before", r.before()[k]);
      n.put("ngrams_kept", r.after()[k]);
    }
    if (before != null) {
      o.put("text", text.toString());
      o.put("perplexity_before", before.perplexity());
      o.put("perplexity_after", after.perplexity());
      o.put("perplexity_change_relative", after.perplexity() / before.perplexity() - 1);
      o.put("convention", PerplexityResult.CONVENTION);
    }
    o.put("out", out.toString());
    return o;
  }

  private void printText(EntropyPruner.Result r, PerplexityResult before, PerplexityResult after) {
    // The model itself takes standard output with --out -: the report goes to stderr then.
    PrintWriter o = OutputTarget.kind(out) == OutputTarget.Kind.STDOUT ? spec.commandLine().getErr() : spec.commandLine().getOut();
    for (int k = 0; k < r.before().length; k++)
      o.printf(Locale.ROOT, "order %d  kept %d of %d n-grams%n", k + 1, r.after()[k], r.before()[k]);
    if (before != null) {
      o.printf(Locale.ROOT, "held-out perplexity %.4f -> %.4f (%+.3f %%)%n", before.perplexity(), after.perplexity(),
          100 * (after.perplexity() / before.perplexity() - 1));
    }
    o.printf(Locale.ROOT, "wrote %s%n", out);
    o.flush();
  }
}
