package steelyard.history;

import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import steelyard.eval.Bootstrap;
import steelyard.eval.CorpusScore;
import steelyard.eval.EditCounts;
import steelyard.eval.MissingHypothesisPolicy;
import steelyard.rescore.ModelIdentity;
import steelyard.rescore.RescoreSummary;
import steelyard.rescore.WeightsFile;
import steelyard.rescore.WeightsSpec;
import steelyard.text.Unit;

/**
 * Everything the run history keeps about one run of a scoring, rescoring, tuning or audit command: enough to say
 * later which weights were used, on what data, with which model, what they scored, and to compare two runs on the
 * same references with a paired test without the original files.
 *
 * <p>Build one with {@link #builder}; the input files are hashed only in {@link Builder#build()}, which the
 * recorder calls only when history is switched on.
 *
 * @param startedAt     when the run started (from the command's clock), millisecond precision
 * @param wallMillis    wall time from the start to the moment the record was built, in milliseconds
 * @param toolVersion   the Steelyard version that made the run
 * @param command       the command's name ({@code score}, {@code compare}, {@code rescore}, …)
 * @param commandLine   the arguments after {@code steelyard}, exactly as given
 * @param label         a name for the run (a compared system's display name, {@code --system}); null when none
 * @param inputs        the input files with size, SHA-256 and row count, in the order given
 * @param model         the language model (file = path as given); null when none
 * @param weightsJson   the weights in effect as a weights file's text ({@link WeightsFile#toJson}); null when none
 * @param method        how transcripts were picked: {@code first}, {@code oracle}, {@code nbest}, {@code mbr}, …
 * @param unit          token unit of the error counts
 * @param normalisation the normaliser's one-line description; null when not recorded
 * @param missingPolicy how references without a hypothesis counted; null when not recorded
 * @param totals        summed C/S/D/I over the included utterances
 * @param ci95          95 % bootstrap interval of the error rate; {@link Bootstrap.Interval#UNDEFINED} when none
 * @param resamples     bootstrap resamples behind {@code ci95}; 0 when none
 * @param seed          the run's random seed
 * @param utterances    per-utterance counts in reference-file order
 * @param warnings      the run's warnings, in order
 */
public record RunRecord(
    Instant startedAt,
    long wallMillis,
    String toolVersion,
    String command,
    List<String> commandLine,
    String label,
    List<InputFile> inputs,
    ModelIdentity model,
    String weightsJson,
    String method,
    Unit unit,
    String normalisation,
    MissingHypothesisPolicy missingPolicy,
    EditCounts totals,
    Bootstrap.Interval ci95,
    int resamples,
    long seed,
    UtteranceCounts utterances,
    List<String> warnings) {

  public RunRecord {
    Objects.requireNonNull(startedAt, "startedAt");
    Objects.requireNonNull(toolVersion, "toolVersion");
    Objects.requireNonNull(method, "method");
    Objects.requireNonNull(unit, "unit");
    Objects.requireNonNull(totals, "totals");
    Objects.requireNonNull(ci95, "ci95");
    Objects.requireNonNull(utterances, "utterances");
    if (command == null || command.isBlank()) throw new IllegalArgumentException("command must be named: '" + command + "'");
    if (wallMillis < 0) throw new IllegalArgumentException("wall time must not be negative: " + wallMillis);
    if (resamples < 0) throw new IllegalArgumentException("resamples must not be negative: " + resamples);
    startedAt = startedAt.truncatedTo(ChronoUnit.MILLIS);
    commandLine = List.copyOf(commandLine);
    inputs = List.copyOf(inputs);
    warnings = List.copyOf(warnings);
  }

  /** S + D + I over the included utterances. */
  public long errors() {
    return totals.errors();
  }

  /** N, the reference tokens of the included utterances. */
  public long referenceTokens() {
    return totals.referenceTokens();
  }

  /** (S + D + I) / N; NaN when N = 0. */
  public double errorRate() {
    return totals.errorRate();
  }

  /** SHA-256 of the references file: which test data the run was scored on; null when it had none. */
  public String dataSha256() {
    for (InputFile f : inputs) if (f.role().equals(InputFile.REFERENCES)) return f.sha256();
    return null;
  }

  /** The path of the first input with {@code role}, as given; null when none. */
  public String inputPath(String role) {
    for (InputFile f : inputs) if (f.role().equals(role)) return f.path();
    return null;
  }

  /**
   * A builder for a run of {@code command} that started at {@code started}; {@code clock} gives the end of the run
   * when {@link Builder#build()} is called.
   */
  public static Builder builder(String command, Instant started, Clock clock) {
    return new Builder(command, started, clock);
  }

  /** The version of this build (the jar manifest's {@code Implementation-Version}), or {@code development build}. */
  public static String currentToolVersion() {
    String v = RunRecord.class.getPackage().getImplementationVersion();
    return v == null ? "development build" : v;
  }

  /** Collects a run's facts as the command goes; not thread-safe. */
  public static final class Builder {
    private final String command;
    private final Instant started;
    private final Clock clock;
    private String toolVersion = currentToolVersion();
    private List<String> commandLine = List.of();
    private String label;
    private final List<PendingInput> inputs = new ArrayList<>();
    private ModelIdentity model;
    private String weightsJson;
    private String method;
    private Unit unit;
    private String normalisation;
    private MissingHypothesisPolicy missingPolicy;
    private EditCounts totals = EditCounts.ZERO;
    private Bootstrap.Interval ci95 = Bootstrap.Interval.UNDEFINED;
    private int resamples;
    private long seed;
    private UtteranceCounts utterances = UtteranceCounts.EMPTY;
    private final List<String> warnings = new ArrayList<>();
    private int bootstrapThreads;

    private Builder(String command, Instant started, Clock clock) {
      this.command = command;
      this.started = Objects.requireNonNull(started, "started");
      this.clock = Objects.requireNonNull(clock, "clock");
    }

    public Builder toolVersion(String v) {
      toolVersion = v;
      return this;
    }

    public Builder commandLine(List<String> args) {
      commandLine = List.copyOf(args);
      return this;
    }

    /** A name for the run; null or blank for none. */
    public Builder label(String l) {
      label = l == null || l.isBlank() ? null : l;
      return this;
    }

    /** An input file, hashed at {@link #build()}; ignored when {@code file} is null. */
    public Builder input(String role, Path file, long rows) {
      if (file != null) inputs.add(new PendingInput(role, file, rows));
      return this;
    }

    /** The model at {@code path} (as given) with its identity; ignored when either is null. */
    public Builder model(Path path, ModelIdentity id) {
      if (path != null && id != null) model = new ModelIdentity(path.toString(), id.order(), id.bytes(), id.sha256());
      return this;
    }

    /** The weights in effect; stored as the text {@link WeightsFile#toJson} gives. */
    public Builder weights(WeightsSpec spec) {
      weightsJson = spec == null ? null : WeightsFile.toJson(spec);
      return this;
    }

    public Builder method(String m) {
      method = m;
      return this;
    }

    /** The token unit and the normaliser's description. */
    public Builder unit(Unit u, String normalisationDescription) {
      unit = u;
      normalisation = normalisationDescription;
      return this;
    }

    /** How references without a hypothesis counted (rescoring counts them as all deletions). */
    public Builder missingPolicy(MissingHypothesisPolicy p) {
      missingPolicy = p;
      return this;
    }

    /** Summed counts over the included utterances. */
    public Builder totals(EditCounts t) {
      totals = Objects.requireNonNull(t, "totals");
      return this;
    }

    /** The bootstrap interval of the error rate, its resamples and the seed. */
    public Builder interval(Bootstrap.Interval ci, int resampleCount, long randomSeed) {
      ci95 = Objects.requireNonNull(ci, "ci");
      resamples = resampleCount;
      seed = randomSeed;
      bootstrapThreads = 0;
      return this;
    }

    /**
     * The bootstrap interval computed at {@link #build()} from the per-utterance rows, exactly as {@code score}
     * computes it ({@link Bootstrap#corpusRate} over the included rows in order): only when the run is recorded.
     */
    public Builder bootstrap(int resampleCount, long randomSeed, int threads) {
      if (threads < 1) throw new IllegalArgumentException("threads must be at least 1: " + threads);
      resamples = resampleCount;
      seed = randomSeed;
      bootstrapThreads = threads;
      return this;
    }

    /** The random seed of a run without an interval. */
    public Builder seed(long randomSeed) {
      seed = randomSeed;
      return this;
    }

    /** Per-utterance counts in reference-file order. */
    public Builder utterances(UtteranceCounts u) {
      utterances = Objects.requireNonNull(u, "utterances");
      return this;
    }

    /** Appends warnings in order. */
    public Builder warnings(List<String> w) {
      warnings.addAll(w);
      return this;
    }

    /**
     * Everything a {@link CorpusScore} says: the pick as method, the missing-hypothesis policy, the totals, the
     * per-utterance rows and the scorer's warnings (appended).
     */
    public Builder scored(CorpusScore s) {
      method = s.pick().label();
      missingPolicy = s.missingPolicy();
      totals = s.totals();
      utterances = UtteranceCounts.of(s);
      warnings.addAll(s.warnings());
      return this;
    }

    /**
     * Everything a rescoring run with references says: its method, references without hypotheses counted as all
     * deletions, the totals of the picks, the per-utterance rows in reference-file order
     * ({@link UtteranceCounts#of(RescoreSummary)}), the bootstrap interval and the run's warnings (appended).
     */
    public Builder rescored(String methodLabel, RescoreSummary s, Bootstrap.Interval ci, int resampleCount, long randomSeed) {
      method = methodLabel;
      missingPolicy = MissingHypothesisPolicy.ALL_DELETIONS;
      totals = s.chosen();
      utterances = UtteranceCounts.of(s);
      warnings.addAll(s.warnings());
      return interval(ci == null ? Bootstrap.Interval.UNDEFINED : ci, resampleCount, randomSeed);
    }

    /** The record, with the inputs hashed now and the wall time measured to now. */
    public RunRecord build() {
      List<InputFile> hashed = new ArrayList<>(inputs.size());
      for (PendingInput p : inputs) hashed.add(InputFile.of(p.role, p.file, p.rows));
      if (bootstrapThreads > 0)
        ci95 = Bootstrap.corpusRate(utterances.includedErrors(), utterances.includedReferenceTokens(), resamples, seed, bootstrapThreads);
      long wall = Math.max(0, Duration.between(started, clock.instant()).toMillis());
      return new RunRecord(started, wall, toolVersion, command, commandLine, label, hashed, model, weightsJson, method, unit,
          normalisation, missingPolicy, totals, ci95, resamples, seed, utterances, warnings);
    }

    private record PendingInput(String role, Path file, long rows) {}
  }
}
