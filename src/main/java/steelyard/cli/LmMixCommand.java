package steelyard.cli;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import it.unimi.dsi.fastutil.doubles.DoubleArrayList;
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
import steelyard.lm.LmState;
import steelyard.lm.MixtureModel;
import steelyard.lm.ModelFiles;
import steelyard.lm.eval.Perplexity;
import steelyard.lm.eval.PerplexityResult;
import steelyard.lm.mix.MixtureWeights;
import steelyard.lm.mix.StaticMixture;

/** Linear interpolation of two or more models, weights tuned by EM on held-out text, written as one model. */
@Command(name = "mix", mixinStandardHelpOptions = true,
    description = "Interpolate two or more models with mixture weights tuned by EM to minimise held-out perplexity, "
        + "and write the static approximation as one model.")
public final class LmMixCommand implements Callable<Integer> {
  @Spec picocli.CommandLine.Model.CommandSpec spec;
  @Mixin NormalisationInput normalisation;

  @Option(names = "--lm", required = true, paramLabel = "FILE", description = "A component model (repeat: at least two).")
  List<Path> models;

  @Option(names = "--text", required = true, paramLabel = "FILE", description = "Held-out text for EM and the perplexity report.")
  Path text;

  @Option(names = "--mix-weights", paramLabel = "W1,W2,...", split = ",", description = "Fixed mixture weights (skip EM); normalised to sum 1.")
  double[] fixedWeights;

  @Option(names = "--iterations", paramLabel = "N", defaultValue = "50", description = "Maximum EM iterations (default ${DEFAULT-VALUE}).")
  int iterations;

  @Option(names = "--tolerance", paramLabel = "X", defaultValue = "1e-6", description = "Stop when the relative perplexity change is below X (default ${DEFAULT-VALUE}).")
  double tolerance;

  @Option(names = "--out", required = true, paramLabel = "FILE", description = "Mixed model: .arpa, .arpa.gz or .bin.")
  Path out;

  @Mixin JsonOutputOption json;

  @Override
  public Integer call() {
    PrintWriter err = spec.commandLine().getErr();
    if (models.size() < 2) throw InputException.option("--lm", "only " + models.size() + " model given", "at least two --lm files");
    List<Path> inputs = new ArrayList<>(models);
    inputs.add(text);
    OutputSet outputs = OutputSet.open(LmModelInput.outputs("--out", out, "--json", json.file), inputs);
    List<BackoffModel> comps = new ArrayList<>();
    ModelFiles.LoadOptions loading = new ModelFiles.LoadOptions(BackoffModel.DEFAULT_UNKNOWN_FLOOR_LOG10, w -> LmModelInput.warn(err, w), null);
    for (Path m : models) comps.add(ModelFiles.loadExact(m, loading));
    String mismatch = StaticMixture.checkCompatible(models, comps);
    if (mismatch != null) LmModelInput.warn(err, mismatch);
    double[] start = new double[comps.size()];
    java.util.Arrays.fill(start, 1.0 / comps.size());
    MixtureModel uniform = new MixtureModel(comps, start);
    Function<String, List<String>> tokenizer = LmModelInput.tokenizer(uniform, normalisation, spec.commandLine().getParseResult(), err);
    List<List<String>> sentences = new ArrayList<>();
    List<String> warnings = new ArrayList<>();
    if (mismatch != null) warnings.add(mismatch);
    LmModelInput.forEachSentence(text, tokenizer, (line, tokens) -> sentences.add(tokens), LmModelInput.warnings(err, warnings));

    MixtureWeights.Fit fit = fixedWeights != null ? fixed(comps.size()) : MixtureWeights.fit(componentLogProbs(uniform, sentences), iterations, tolerance);
    MixtureModel mixture = new MixtureModel(comps, fit.weights());
    BackoffModel approx = StaticMixture.approximate(mixture);
    PerplexityResult exact = perplexity(mixture, sentences);
    PerplexityResult written = perplexity(approx, sentences);
    ModelFiles.save(approx, out, spec.commandLine().getOut());

    ObjectNode report = report(fit, exact, written);
    warnings.forEach(report.putArray("warnings")::add);
    json.write(report, spec.commandLine().getOut());
    outputs.commit();
    if (!json.toStdout()) printText(fit, exact, written);
    return 0;
  }

  private MixtureWeights.Fit fixed(int n) {
    if (fixedWeights.length != n)
      throw InputException.option("--mix-weights", fixedWeights.length + " weights for " + n + " models", "one weight per --lm");
    double sum = 0;
    for (double w : fixedWeights) {
      if (!(w >= 0) || Double.isInfinite(w)) throw InputException.option("--mix-weights", "weight " + w + " is not a finite number >= 0", "non-negative weights");
      sum += w;
    }
    if (!(sum > 0)) throw InputException.option("--mix-weights", "weights sum to 0", "at least one positive weight");
    double[] w = new double[n];
    for (int i = 0; i < n; i++) w[i] = fixedWeights[i] / sum;
    return new MixtureWeights.Fit(w, List.of(), 0);
  }

  /** ln Pᵢ of every scored held-out token (in-vocabulary words and </s>) for each component. */
  private static double[][] componentLogProbs(MixtureModel mix, List<List<String>> sentences) {
    int k = mix.components().size();
    DoubleArrayList[] rows = new DoubleArrayList[k];
    for (int i = 0; i < k; i++) rows[i] = new DoubleArrayList();
    LmState s = mix.newState();
    for (List<String> sentence : sentences) {
      mix.beginSentence(s);
      for (int t = 0; t <= sentence.size(); t++) {
        int w = t == sentence.size() ? mix.sentenceEndId() : mix.wordId(sentence.get(t));
        if (w != mix.unknownId()) for (int i = 0; i < k; i++) rows[i].add(mix.componentLogProb(i, s, w));
        mix.score(s, w, s);
      }
    }
    double[][] out = new double[k][];
    for (int i = 0; i < k; i++) out[i] = rows[i].toDoubleArray();
    return out;
  }

  private static PerplexityResult perplexity(steelyard.lm.LanguageModel lm, List<List<String>> sentences) {
    Perplexity p = new Perplexity(lm);
    long line = 0;
    for (List<String> s : sentences) p.add(++line, s);
    return p.result();
  }

  private ObjectNode report(MixtureWeights.Fit fit, PerplexityResult exact, PerplexityResult written) {
    ObjectNode o = JsonOutput.object();
    ArrayNode comps = o.putArray("components");
    for (int i = 0; i < models.size(); i++) {
      ObjectNode c = comps.addObject();
      c.put("model", models.get(i).toString());
      c.put("weight", fit.weights()[i]);
    }
    o.put("weights_from", fixedWeights != null ? "fixed" : "em");
    o.put("em_iterations", fit.iterations());
    ArrayNode history = o.putArray("em_perplexity_history");
    fit.perplexities().forEach(history::add);
    o.put("text", text.toString());
    o.put("sentences", exact.sentences());
    o.put("scored_tokens", exact.scoredTokens());
    o.put("oov", exact.oov());
    o.put("perplexity_exact_mixture", exact.perplexity());
    o.put("perplexity_written_model", written.perplexity());
    o.put("log10_prob_exact_mixture", exact.log10Prob());
    o.put("log10_prob_written_model", written.log10Prob());
    o.put("out", out.toString());
    o.put("convention", PerplexityResult.CONVENTION);
    return o;
  }

  private void printText(MixtureWeights.Fit fit, PerplexityResult exact, PerplexityResult written) {
    // The model itself takes standard output with --out -: the report goes to stderr then.
    PrintWriter o = OutputTarget.kind(out) == OutputTarget.Kind.STDOUT ? spec.commandLine().getErr() : spec.commandLine().getOut();
    for (int i = 0; i < models.size(); i++) o.printf(Locale.ROOT, "weight %.6f  %s%n", fit.weights()[i], models.get(i));
    o.printf(Locale.ROOT, "weights from %s (%d EM iterations)%n", fixedWeights != null ? "--mix-weights" : "EM on " + text, fit.iterations());
    o.printf(Locale.ROOT, "held-out perplexity, exact mixture:        %.4f%n", exact.perplexity());
    o.printf(Locale.ROOT, "held-out perplexity, written single model: %.4f  (static approximation: union of n-grams, back-off weights renormalised)%n", written.perplexity());
    o.printf(Locale.ROOT, "wrote %s%n", out);
    o.println("convention: " + PerplexityResult.CONVENTION);
    o.flush();
  }
}
