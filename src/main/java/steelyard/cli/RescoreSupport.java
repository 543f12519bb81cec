package steelyard.cli;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintStream;
import java.io.Writer;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import steelyard.eval.EditCounts;
import steelyard.io.FeatureSpec;
import steelyard.io.ImportOptions;
import steelyard.lm.LanguageModel;
import steelyard.lm.ModelFiles;
import steelyard.rescore.Tokenizer;
import steelyard.rescore.WeightsFile;
import steelyard.rescore.WeightsSpec;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.Unit;
import steelyard.io.InputException;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSummary;

/** Output helpers of {@code rescore}: path checks, JSON writing, the stderr summary. */
final class RescoreSupport {
  private static final ObjectMapper MAPPER = new ObjectMapper()
      .disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET)
      .enable(JsonGenerator.Feature.WRITE_BIGDECIMAL_AS_PLAIN);

  private RescoreSupport() {}

  /** The model at {@code lm}, or null when none is given; an {@link InputException} when one is {@code needed} but absent. */
  static LanguageModel loadModel(Path lm, boolean needed) {
    if (lm == null) {
      if (needed)
        throw InputException.option("--lm", "no model given, but the LM weight, OOV weight or lattice LM weight is not 0",
            "--lm FILE, or weights of 0");
      return null;
    }
    return ModelFiles.load(lm);
  }

  /**
   * The weights file's partial weights (empty without a file). Fills {@code names} with the feature names of
   * {@code specs}; when {@code specs} is empty, the run takes its features from the file (added to both).
   */
  static WeightsSpec readWeights(Path file, List<FeatureSpec> specs, List<String> names) {
    for (FeatureSpec s : specs) names.add(s.name());
    WeightsSpec fileSpec = file == null ? new WeightsSpec() : WeightsFile.read(file, names);
    if (specs.isEmpty()) {
      for (String n : fileSpec.features.keySet()) specs.add(FeatureSpec.parse(n));
      names.addAll(fileSpec.features.keySet());
    }
    return fileSpec;
  }

  /** The scoring unit: --unit when given, else the weights file's unit, else the model's, else the option's default. */
  static Unit unit(boolean unitGiven, Unit option, WeightsSpec fileSpec, LanguageModel model) {
    if (unitGiven) return option;
    if (fileSpec.unit != null) return fileSpec.unit;
    return model != null ? model.unit() : option;
  }

  /** Tokenisation for the model: {@code unitTokens} when the model shares unit and normalisation, else the model's own. */
  static Tokenizer lmTokens(LanguageModel model, Unit unit, NormalisationOptions options, Tokenizer unitTokens) {
    if (model == null || (model.unit() == unit && model.normalisation().equals(options))) return unitTokens;
    Normaliser lmNorm = Normaliser.create(model.normalisation());
    Unit lmUnit = model.unit();
    return raw -> lmNorm.tokens(raw, lmUnit);
  }

  /** {@code o} reading exactly the feature columns {@code specs}. */
  static ImportOptions withFeatures(ImportOptions o, List<FeatureSpec> specs) {
    return new ImportOptions(specs, o.primarySystem(), o.maxBadRows(), o.warnings(), o.skipped());
  }

  /** The unit's name as the command line and the weights file spell it. */
  static String label(Unit u) {
    return u == Unit.WORD ? "word" : "char";
  }

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

  static void printSummary(PrintStream err, RescoreSummary s, RescoreMethod method, boolean withReferences, Unit unit) {
    err.printf(Locale.ROOT, "steelyard rescore: %d utterances by %s; %d choices differ from rank 1%s%s%n",
        s.utterances(), method.label(), s.changed(),
        s.newTranscripts() > 0 ? ", " + s.newTranscripts() + " are new transcripts" : "",
        s.cappedUtterances() > 0 ? "; the hypothesis cap applied in " + s.cappedUtterances() : "");
    if (withReferences) {
      err.printf(Locale.ROOT, "  %s %s (rank 1 %s, N-best oracle %s) over %d utterances%n",
          unit == Unit.CHAR ? "CER" : "WER", percent(s.chosen()), percent(s.first()), percent(s.oracle()), s.scored());
    }
    err.println("  note: " + RescoreSummary.NOTICE);
  }

  private static String percent(EditCounts c) {
    return c.referenceTokens() == 0 ? "n/a" : String.format(Locale.ROOT, "%.2f %%", 100.0 * c.errors() / c.referenceTokens());
  }
}
