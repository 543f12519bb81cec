package steelyard.cli;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.JsonOutput;
import steelyard.io.OutputSet;
import steelyard.lm.CompactModel;
import steelyard.lm.eval.Perplexity;
import steelyard.lm.eval.PerplexityResult;

/** Perplexity and OOV rate of a model on held-out text. */
@Command(name = "perplexity", mixinStandardHelpOptions = true, description = "Perplexity and OOV rate of a model on held-out text (one sentence per line).")
public final class LmPerplexityCommand implements Callable<Integer> {
  @Spec picocli.CommandLine.Model.CommandSpec spec;
  @Mixin LmModelInput input;
  @Mixin NormalisationInput normalisation;

  @Option(names = "--text", required = true, paramLabel = "FILE", description = "Held-out text, one sentence per line (.gz accepted).")
  Path text;

  @Mixin JsonOutputOption json;

  @Override
  public Integer call() {
    input.require();
    PrintWriter err = spec.commandLine().getErr();
    OutputSet outputs = OutputSet.open(java.util.Collections.singletonMap("--json", json.file), java.util.List.of(input.lm, text));
    CompactModel lm = input.load(err);
    var tokenizer = LmModelInput.tokenizer(lm, normalisation, spec.commandLine().getParseResult(), err);
    Perplexity ppl = new Perplexity(lm);
    java.util.List<String> warnings = new java.util.ArrayList<>();
    LmModelInput.forEachSentence(text, tokenizer, ppl::add, LmModelInput.warnings(err, warnings));
    PerplexityResult r = ppl.result();
    if (json.file != null) {
      ObjectNode o = json(r);
      warnings.forEach(o.putArray("warnings")::add);
      json.write(o, spec.commandLine().getOut());
      outputs.commit();
      if (json.toStdout()) return 0;
    }
    PrintWriter out = spec.commandLine().getOut();
    out.printf(Locale.ROOT, "sentences   %d%n", r.sentences());
    out.printf(Locale.ROOT, "tokens      %d (%d words + %d </s>)%n", r.tokens(), r.words(), r.sentences());
    out.printf(Locale.ROOT, "oov         %d (%.2f %% of words)%n", r.oov(), 100 * r.oovRate());
    out.printf(Locale.ROOT, "log10_prob  %.4f%n", r.log10Prob());
    out.printf(Locale.ROOT, "perplexity  %.4f%n", r.perplexity());
    out.println("convention  " + PerplexityResult.CONVENTION);
    out.flush();
    return 0;
  }

  private ObjectNode json(PerplexityResult r) {
    ObjectNode o = JsonOutput.object();
    o.put("model", input.lm.toString());
    o.put("text", text.toString());
    o.put("sentences", r.sentences());
    o.put("words", r.words());
    o.put("tokens", r.tokens());
    o.put("oov", r.oov());
    o.put("oov_rate", r.oovRate());
    o.put("scored_tokens", r.scoredTokens());
    o.put("log10_prob", r.log10Prob());
    o.put("ln_prob", r.lnProb());
    o.put("perplexity", r.perplexity());
    o.put("log10_prob_with_oov", r.log10ProbWithOov());
    o.put("convention", PerplexityResult.CONVENTION);
    return o;
  }
}
