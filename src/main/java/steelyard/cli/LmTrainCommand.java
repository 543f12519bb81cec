package steelyard.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.JsonOutput;
import steelyard.io.InputException;
import steelyard.io.InputFiles;
import steelyard.io.OutputSet;
import steelyard.lm.ModelFiles;
import steelyard.lm.train.CorpusFile;
import steelyard.lm.train.Discounts;
import steelyard.lm.train.Smoothing;
import steelyard.lm.train.TrainedModel;
import steelyard.lm.train.Trainer;
import steelyard.lm.train.TrainingOptions;
import steelyard.lm.train.TrainingReport;
import steelyard.text.Normaliser;

/** Train an n-gram language model from a text corpus (one sentence per line) and save it. */
@Command(name = "train", mixinStandardHelpOptions = true,
    description = "Train an n-gram language model from a text corpus (one sentence per line, .gz accepted).")
public final class LmTrainCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Option(names = "--corpus", required = true, paramLabel = "FILE", description = "Training corpus, one sentence per line.")
  Path corpus;

  @Option(names = "--order", required = true, paramLabel = "N", description = "N-gram order, 1 to 6.")
  int order;

  @Mixin NormalisationInput normalisation = new NormalisationInput();

  @Option(names = "--smoothing", paramLabel = "mkn|wb|abs|addk", defaultValue = "mkn",
      description = "Modified Kneser-Ney (default), Witten-Bell, absolute discounting, or add-k (in memory only: cannot be saved).")
  Smoothing smoothing;

  @Option(names = "--vocab-min-count", paramLabel = "K", defaultValue = "0",
      description = "Words seen fewer than K times become <unk>.")
  int vocabMinCount;

  @Option(names = "--max-vocab", paramLabel = "V", defaultValue = "0",
      description = "Keep only the V most frequent words; the rest become <unk>. 0: no limit.")
  int maxVocab;

  @Option(names = "--min-count", paramLabel = "ORDER=C", split = ",",
      description = "Keep n-grams of this order (2 and up) only when seen at least C times, e.g. 2=2,3=2; orders not named keep every n-gram. A dropped n-gram's probability mass goes to the back-off.")
  List<String> minCount = new ArrayList<>();

  /** 0.1's form of --min-count, hidden: per-order cut-offs C1,C2,… (C1 = 0, the last repeating), dropping counts ≤ Ck. */
  @Option(names = "--cutoffs", hidden = true, paramLabel = "C1,C2,…", split = ",", description = "Old form of --min-count.")
  int[] cutoffs;

  @Option(names = "--out", required = true, paramLabel = "FILE", description = "Model file: .arpa, .arpa.gz or .bin.")
  Path out;

  @Mixin JsonOutputOption json;

  @Option(names = "--progress", description = "Show progress on stderr even when it is not a terminal.")
  boolean progress;

  @Override
  public Integer call() throws IOException {
    TrainingOptions options = options();
    OutputSet outputs = OutputSet.open(LmModelInput.outputs("--out", out, "--json", json.file), java.util.List.of(corpus));
    Normaliser normaliser = Normaliser.create(options.normalisation());
    List<String> warnings = new ArrayList<>();
    CorpusFile lines = new CorpusFile(corpus, normaliser, options.unit(), w -> {
      warnings.add(w);
      LmModelInput.warn(spec.commandLine().getErr(), w);
    });
    Trainer trainer = new Trainer(options);
    TrainedModel trained;
    try (ProgressBar bar = progressBar()) {
      if (bar != null) trainer.onSentences(bar::stepTo);
      trained = trainer.train(lines);
    }
    long saveStart = System.nanoTime();
    ModelFiles.save(trained.backoffModel(), out, spec.commandLine().getOut());
    double saveSeconds = (System.nanoTime() - saveStart) / 1e9;
    PrintWriter err = spec.commandLine().getErr();
    err.print(humanReport(trained.report(), saveSeconds));
    err.flush();
    if (json.file != null) writeJson(trained.report(), saveSeconds, warnings);
    outputs.commit();
    return Main.OK;
  }

  private TrainingOptions options() throws IOException {
    if (order < 1 || order > 6) throw InputException.option("--order", "order " + order + " is out of range", "1 to 6");
    if (!smoothing.hasBackoffForm())
      throw InputException.option("--smoothing", "add-k smoothing has no exact back-off form, so it cannot be written as a model file",
          "mkn, wb or abs to save a model (add-k is for in-memory comparisons only)");
    if (vocabMinCount < 0) throw InputException.option("--vocab-min-count", "negative count " + vocabMinCount, "0 or more");
    if (maxVocab < 0) throw InputException.option("--max-vocab", "negative size " + maxVocab, "0 (no limit) or more");
    int[] minCounts = cutoffs != null ? MinCounts.fromCutoffs(cutoffs, order, minCount, spec.commandLine().getErr())
        : MinCounts.parse(minCount, order);
    ModelFiles.outputKind(out);
    if (sameFile(corpus, out))
      throw InputException.option("--out", "'" + out + "' is the training corpus", "a different file than --corpus");
    if (!corpus.toString().equals("-") && !Files.exists(corpus)) throw InputException.inFile(corpus, "no such file", "a readable corpus file");
    if (vocabMinCount > 0 || maxVocab > 0)
      InputFiles.requireRereadable(corpus, (vocabMinCount > 0 ? "--vocab-min-count" : "--max-vocab") + " reads the corpus twice (word counts first)");
    return new TrainingOptions(order, normalisation.unit, normalisation.options(), smoothing, vocabMinCount, maxVocab,
        minCounts, 1.0);
  }

  private static boolean sameFile(Path a, Path b) throws IOException {
    if (a.toAbsolutePath().normalize().equals(b.toAbsolutePath().normalize())) return true;
    return Files.exists(a) && Files.exists(b) && Files.isSameFile(a, b);
  }

  private ProgressBar progressBar() {
    if (!ConsoleProgress.wanted(progress)) return null;
    return new ProgressBarBuilder().setTaskName("counting").setInitialMax(-1).setUnit(" sentences", 1)
        .setStyle(ProgressBarStyle.ASCII).setConsumer(new ConsoleProgress(spec.commandLine().getErr()))
        .setUpdateIntervalMillis(500).build();
  }

  private String humanReport(TrainingReport r, double saveSeconds) {
    StringBuilder sb = new StringBuilder();
    sb.append(String.format(Locale.ROOT, "trained a %s %d-gram model (%s) -> %s%n",
        normalisation.unit.name().toLowerCase(Locale.ROOT), r.order(), r.smoothing().key(), out));
    sb.append(String.format(Locale.ROOT, "  corpus       %d sentences, %d tokens, %d mapped to <unk>, %d empty lines skipped%n",
        r.sentences(), r.tokens(), r.unknownTokens(), r.emptyLines()));
    sb.append(String.format(Locale.ROOT, "  vocabulary   %d token ids (with <s>, </s>, <unk>)%n", r.vocabularySize()));
    for (int k = 1; k <= r.order(); k++) {
      Discounts d = r.discounts().isEmpty() ? null : r.discounts().get(k - 1);
      sb.append(String.format(Locale.ROOT, "  order %d      %d n-grams listed of %d distinct%s%n", k,
          r.listedNgrams()[k - 1], r.distinctNgrams()[k - 1],
          d == null || d.values().length == 0 ? "" : ", discounts " + d.formatted()));
    }
    for (String w : r.warnings()) sb.append("  warning: ").append(w).append(System.lineSeparator());
    sb.append(String.format(Locale.ROOT, "  time         %.2f s counting and estimation, %.2f s writing%n", r.seconds(), saveSeconds));
    return sb.toString();
  }

  private void writeJson(TrainingReport r, double saveSeconds, List<String> commandWarnings) {
    Map<String, Object> m = new LinkedHashMap<>();
    m.put("model", out.toString());
    m.put("unit", normalisation.unit.name().toLowerCase(Locale.ROOT));
    m.put("order", r.order());
    m.put("smoothing", r.smoothing().key());
    m.put("sentences", r.sentences());
    m.put("tokens", r.tokens());
    m.put("unk_tokens", r.unknownTokens());
    m.put("empty_lines", r.emptyLines());
    m.put("vocabulary", r.vocabularySize());
    List<Map<String, Object>> orders = new ArrayList<>();
    for (int k = 1; k <= r.order(); k++) {
      Map<String, Object> o = new LinkedHashMap<>();
      o.put("order", k);
      o.put("distinct", r.distinctNgrams()[k - 1]);
      o.put("listed", r.listedNgrams()[k - 1]);
      if (!r.discounts().isEmpty()) {
        Discounts d = r.discounts().get(k - 1);
        o.put("count_of_counts", d.countOfCounts());
        o.put("discounts", d.values());
        o.put("discount_replaced", d.replaced());
      }
      orders.add(o);
    }
    m.put("ngrams", orders);
    List<String> allWarnings = new ArrayList<>(commandWarnings);
    allWarnings.addAll(r.warnings());
    m.put("warnings", allWarnings);
    m.put("seconds_training", r.seconds());
    m.put("seconds_writing", saveSeconds);
    JsonOutput.write(json.file, JsonOutput.tree(m), spec.commandLine().getOut());
  }
}
