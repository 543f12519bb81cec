package steelyard.cli;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.function.Function;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import picocli.CommandLine;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.InputException;
import steelyard.io.InputFiles;
import steelyard.lm.BackoffModel;
import steelyard.lm.CompactModel;
import steelyard.lm.LanguageModel;
import steelyard.lm.LoadProgress;
import steelyard.lm.ModelFiles;
import steelyard.lm.ModelText;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * Options of the commands that read one model: {@code --lm}, {@code --oov-log10-prob}, {@code --progress}. The
 * {@code lm} commands require {@code --lm} ({@link #require}); {@code rescore} and {@code network} need it only
 * when a weight uses the model.
 */
public final class LmModelInput {
  @Spec(Spec.Target.MIXEE) CommandSpec mixee;

  @Option(names = "--lm", paramLabel = "FILE",
      description = "Model file: .arpa, .arpa.gz or .bin (rescore and network: needed when λ, ω or λ′ is not 0).")
  public Path lm;

  @Option(names = "--oov-log10-prob", paramLabel = "X", defaultValue = "-7",
      description = "log10 probability of an out-of-vocabulary token when the model lists no <unk> (closed vocabulary). Default ${DEFAULT-VALUE}.")
  public double unknownLog10;

  @Option(names = "--progress", description = "Show loading progress on stderr (default: only when attached to a console).")
  public boolean progress;

  /** The model file; a usage error (as for a missing required option) when none is given. */
  public Path require() {
    if (lm == null) throw new CommandLine.ParameterException(mixee.commandLine(), "Missing required option: '--lm=FILE'");
    return lm;
  }

  /** How a rescoring session loads the model: this floor, progress on {@code err}; warnings left to the session. */
  ModelFiles.LoadOptions sessionLoading(PrintWriter err) {
    return new ModelFiles.LoadOptions(unknownLog10, null, ConsoleProgress.wanted(progress) ? new Bar(err) : null);
  }

  /** The model as the compact query engine. */
  public CompactModel load(PrintWriter err) {
    return ModelFiles.load(lm, options(err));
  }

  /** The model in its exact editable form. */
  public BackoffModel loadExact(PrintWriter err) {
    return ModelFiles.loadExact(lm, options(err));
  }

  private ModelFiles.LoadOptions options(PrintWriter err) {
    return new ModelFiles.LoadOptions(unknownLog10, w -> warn(err, w), ConsoleProgress.wanted(progress) ? new Bar(err) : null);
  }

  /**
   * The tokenizer for held-out text, by the one rule of {@link ModelText} (the model's recorded unit and
   * normalisation plus the user's rules file); a warning when the user's own normalisation options differ from
   * the model's.
   */
  static Function<String, List<String>> tokenizer(LanguageModel lm, NormalisationInput user, CommandLine.ParseResult parsed, PrintWriter err) {
    NormalisationOptions mine = user.options();
    NormalisationOptions model = lm.normalisation();
    boolean given = false;
    for (String name : List.of("--unit", "--fold-case", "--strip-punct", "--split-hyphens", "--ignore-space")) {
      given |= parsed.hasMatchedOption(name);
    }
    boolean differs = user.unit != lm.unit() || mine.foldCase() != model.foldCase() || mine.stripPunctuation() != model.stripPunctuation()
        || mine.splitHyphens() != model.splitHyphens() || mine.ignoreWhitespace() != model.ignoreWhitespace();
    if (given && differs) {
      warn(err, "the normalisation options given (" + user.unit.name().toLowerCase(java.util.Locale.ROOT) + ", " + LmInfoCommand.describe(mine)
          + ") differ from the model's (" + lm.unit().name().toLowerCase(java.util.Locale.ROOT) + ", " + LmInfoCommand.describe(model)
          + "); the text is normalised as the model was trained");
    }
    Normaliser normaliser = ModelText.normaliser(lm, user.rules);
    Unit unit = lm.unit();
    return raw -> normaliser.tokenList(raw, unit);
  }

  /** Calls {@code sink} with (line number, tokens) for every line of {@code text}. */
  static void forEachSentence(Path text, Function<String, List<String>> tokenizer, SentenceSink sink) {
    forEachSentence(text, tokenizer, sink, w -> { });
  }

  /**
   * Calls {@code sink} with (line number, tokens) for every line of {@code text}; a first line that looks like
   * a CSV header gives one warning to {@code warnings}.
   */
  static void forEachSentence(Path text, Function<String, List<String>> tokenizer, SentenceSink sink, java.util.function.Consumer<String> warnings) {
    try (BufferedReader in = InputFiles.open(text)) {
      long line = 0;
      String raw;
      while ((raw = in.readLine()) != null) {
        if (line == 0) {
          String w = InputFiles.csvHeaderWarning(text, raw);
          if (w != null) warnings.accept(w);
        }
        sink.accept(++line, tokenizer.apply(raw));
      }
    } catch (IOException e) {
      throw InputException.inFile(text, "cannot read (" + e.getMessage() + ")", "a readable text file").withCause(e);
    }
  }

  /** Receives one normalised sentence. */
  @FunctionalInterface
  interface SentenceSink {
    void accept(long line, List<String> tokens);
  }

  /** A warning sink that prints to {@code err} and keeps the warning for a JSON report. */
  static java.util.function.Consumer<String> warnings(PrintWriter err, List<String> kept) {
    return w -> {
      kept.add(w);
      warn(err, w);
    };
  }

  /** Output paths by option, in order, for {@link steelyard.io.OutputSet#open} (null paths are skipped there). */
  static java.util.Map<String, Path> outputs(String option, Path path, String option2, Path path2) {
    java.util.Map<String, Path> m = new java.util.LinkedHashMap<>();
    m.put(option, path);
    m.put(option2, path2);
    return m;
  }

  static void warn(PrintWriter err, String message) {
    err.println("steelyard: warning: " + message);
    err.flush();
  }

  /** Progress on the command's stderr. */
  private static final class Bar implements LoadProgress {
    private final PrintWriter err;
    private ProgressBar bar;

    Bar(PrintWriter err) {
      this.err = err;
    }

    @Override
    public void start(long total) {
      bar = new ProgressBarBuilder().setTaskName("reading n-grams").setInitialMax(total)
          .setConsumer(new ConsoleProgress(err)).setUpdateIntervalMillis(250).build();
    }

    @Override
    public void step(long done) {
      if (bar != null) bar.stepTo(done);
    }

    @Override
    public void end() {
      if (bar != null) {
        bar.stepTo(bar.getMax());
        bar.close();
      }
    }
  }
}
