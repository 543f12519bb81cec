package steelyard.lm.train;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.function.LongConsumer;
import steelyard.io.InputException;
import steelyard.lm.BackoffModel;
import steelyard.lm.ModelMetadata;
import steelyard.text.NormalisationOptions;
import steelyard.text.Vocabulary;

/**
 * Trains an n-gram model from a {@link SentenceSource}: interns tokens once into ids, counts every n-gram
 * of orders 1 … N of each sentence framed by {@code <s>} … {@code </s>} (streaming: memory proportional to
 * the distinct n-grams), then estimates with the chosen {@link Smoothing}.
 *
 * <p>Vocabulary: with {@code vocabMinCount} K a word seen fewer than K times, and with {@code maxVocab} V
 * every word beyond the V most frequent (ties broken by the token's lexicographic order), is replaced by
 * {@code <unk>} before counting, so {@code <unk>} is then a trained token. Without limits {@code <unk>} is
 * listed with the interpolation floor γ(ε)/|V| (modified Kneser-Ney, absolute discounting, Witten-Bell).
 * The token {@code <unk>} in the text counts as {@code <unk>}; {@code <s>} and {@code </s>} in the text are
 * errors. Lines that normalise to nothing are not sentences (counted in the report).
 *
 * <p>Threads: the calling thread reads the source and interns tokens; the smoothing methods with a back-off
 * form count on {@link ShardedCounter}'s two workers, add-k counts on the calling thread (it keeps the
 * look-up tables for querying). Results never depend on the number of cores.
 */
public final class Trainer {
  private final TrainingOptions options;
  private LongConsumer progress = n -> {};

  public Trainer(TrainingOptions options) {
    this.options = Objects.requireNonNull(options, "options");
  }

  /** Called with the number of sentences counted so far, every 16 k sentences (for progress display). */
  public Trainer onSentences(LongConsumer sentencesCounted) {
    this.progress = Objects.requireNonNull(sentencesCounted);
    return this;
  }

  /** Trains on {@code source}; an empty corpus or a reserved token is an {@link InputException}. */
  public TrainedModel train(SentenceSource source) {
    long startNanos = System.nanoTime();
    Vocabulary vocabulary = new Vocabulary();
    vocabulary.intern(BackoffModel.SENTENCE_START);
    vocabulary.intern(BackoffModel.SENTENCE_END);
    vocabulary.intern(BackoffModel.UNKNOWN);
    int[] mapping = options.limitsVocabulary() ? limitedVocabulary(source, vocabulary) : null;
    Vocabulary first = mapping == null ? null : vocabulary;
    Vocabulary model = mapping == null ? vocabulary : modelVocabulary(first, mapping);

    boolean sharded = options.smoothing() != Smoothing.ADDK;
    try (ShardedCounter counter = sharded ? new ShardedCounter(options.order()) : null) {
      return train(source, options, startNanos, mapping, first, model, counter);
    }
  }

  private TrainedModel train(SentenceSource source, TrainingOptions options, long startNanos, int[] mapping,
      Vocabulary first, Vocabulary model, ShardedCounter counter) {
    NgramCounts sequential = counter == null ? new NgramCounts(options.order()) : null;
    long[] stats = new long[4]; // sentences, empty lines, tokens, unknown tokens
    IntArrayList buffer = new IntArrayList();
    source.forEach((line, tokens) -> {
      if (tokens.isEmpty()) {
        stats[1]++;
        return;
      }
      buffer.clear();
      buffer.add(0);
      for (String t : tokens) {
        checkReserved(source, line, t);
        int id;
        if (mapping == null) {
          id = model.intern(t);
        } else {
          int old = first.idOf(t);
          id = old < 0 ? 2 : mapping[old];
        }
        if (id == 2) stats[3]++;
        buffer.add(id);
      }
      buffer.add(1);
      if (counter != null) counter.addSentence(buffer.elements(), buffer.size());
      else sequential.addSentence(buffer.elements(), buffer.size());
      stats[2] += tokens.size();
      if ((++stats[0] & 0x3fff) == 0) progress.accept(stats[0]);
    });
    progress.accept(stats[0]);
    if (stats[0] == 0)
      throw InputException.inFile(source.file(), "no sentence to train on", "at least one non-empty line");
    NgramCounts counts = counter != null ? counter.finish() : sequential;

    long[] distinct = new long[options.order()];
    for (int k = 1; k <= options.order(); k++) distinct[k - 1] = counts.size(k);
    BackoffModel.Builder builder =
        new BackoffModel.Builder(options.order(), options.unit(), options.normalisation());
    for (int id = 3; id < model.size(); id++) builder.tokenId(model.token(id));

    if (options.smoothing() == Smoothing.ADDK) return addK(counts, builder, stats, distinct, model.size(), startNanos);
    Estimator estimator = new Estimator(counts, options, model.size(), 0, 2);
    estimator.estimate();
    metadata(builder, stats, estimator.discounts, estimator.warnings);
    estimator.addTo(builder);
    BackoffModel m = builder.build();
    TrainingReport report = new TrainingReport(options.smoothing(), options.order(), stats[0], stats[1], stats[2],
        stats[3], model.size(), distinct, estimator.listed, estimator.discounts, estimator.warnings,
        seconds(startNanos));
    return new TrainedModel(m, report);
  }

  private TrainedModel addK(NgramCounts counts, BackoffModel.Builder builder, long[] stats, long[] distinct,
      int vocabularySize, long startNanos) {
    addStateEntries(counts, builder);
    metadata(builder, stats, List.of(), List.of());
    AddKModel m = new AddKModel(counts, builder.build(), options.addK());
    long[] listed = distinct.clone();
    if (!containsUnigram(counts, 2)) listed[0]++;
    TrainingReport report = new TrainingReport(options.smoothing(), options.order(), stats[0], stats[1], stats[2],
        stats[3], vocabularySize, distinct, listed, List.of(), List.of(), seconds(startNanos));
    return new TrainedModel(m, report);
  }

  private static void checkReserved(SentenceSource source, long line, String t) {
    if (t.equals(BackoffModel.SENTENCE_START) || t.equals(BackoffModel.SENTENCE_END))
      throw InputException.at(source.file(), line, "the token '" + t + "' is reserved for sentence boundaries",
          "text without sentence markers (one sentence per line)");
  }

  /** First pass: word frequencies; returns the mapping from first-pass ids to model ids (2 = {@code <unk>}). */
  private int[] limitedVocabulary(SentenceSource source, Vocabulary vocabulary) {
    IntArrayList freq = new IntArrayList(new int[] {0, 0, 0});
    source.forEach((line, tokens) -> {
      for (String t : tokens) {
        checkReserved(source, line, t);
        int id = vocabulary.intern(t);
        if (id == freq.size()) freq.add(1); else freq.set(id, freq.getInt(id) + 1);
      }
    });
    int n = vocabulary.size();
    Integer[] words = new Integer[n - 3];
    for (int i = 3; i < n; i++) words[i - 3] = i;
    Arrays.sort(words, (a, b) -> {
      int c = Integer.compare(freq.getInt(b), freq.getInt(a));
      return c != 0 ? c : vocabulary.token(a).compareTo(vocabulary.token(b));
    });
    boolean[] kept = new boolean[n];
    int limit = options.maxVocab() > 0 ? Math.min(options.maxVocab(), words.length) : words.length;
    for (int i = 0; i < limit; i++) {
      if (freq.getInt(words[i]) >= options.vocabMinCount()) kept[words[i]] = true;
    }
    int[] mapping = new int[n];
    int next = 3;
    for (int i = 0; i < n; i++) mapping[i] = i < 3 ? i : kept[i] ? next++ : 2;
    return mapping;
  }

  private static Vocabulary modelVocabulary(Vocabulary first, int[] mapping) {
    Vocabulary v = new Vocabulary();
    for (int i = 0; i < first.size(); i++) if (i < 3 || mapping[i] != 2) v.intern(first.token(i));
    return v;
  }

  /** Add-k keeps raw counts; the back-off structure is only used to track states (orders 1 … N−1). */
  private static void addStateEntries(NgramCounts counts, BackoffModel.Builder builder) {
    for (int k = 1; k < counts.order() || k == 1; k++) {
      for (int e = 0; e < counts.size(k); e++) builder.add(counts.ngram(k, e), 0, 0);
    }
    if (!containsUnigram(counts, 2)) builder.add(new int[] {2}, 0, 0);
  }

  private static boolean containsUnigram(NgramCounts counts, int id) {
    int[] w = counts.words(1);
    for (int e = 0; e < counts.size(1); e++) if (w[e] == id) return true;
    return false;
  }

  private void metadata(BackoffModel.Builder b, long[] stats, List<Discounts> discounts, List<String> warnings) {
    NormalisationOptions n = options.normalisation();
    b.metadata("steelyard.unit=" + options.unit().name().toLowerCase(Locale.ROOT));
    b.metadata("steelyard.order=" + options.order());
    b.metadata("steelyard.smoothing=" + options.smoothing().key());
    b.metadata("steelyard.normalisation.fold_case=" + n.foldCase());
    b.metadata("steelyard.normalisation.strip_punct=" + n.stripPunctuation());
    b.metadata("steelyard.normalisation.split_hyphens=" + n.splitHyphens());
    b.metadata("steelyard.normalisation.ignore_space=" + n.ignoreWhitespace());
    b.metadata("steelyard.normalisation.rules=" + (n.rulesFile() == null ? "none" : n.rulesFile().getFileName()));
    b.metadata("steelyard.vocab_min_count=" + options.vocabMinCount());
    b.metadata("steelyard.max_vocab=" + options.maxVocab());
    for (int k = 1; k <= options.order(); k++) b.metadata(ModelMetadata.MIN_COUNT + k + "=" + options.minCount(k));
    if (options.smoothing() == Smoothing.ADDK) b.metadata("steelyard.add_k=" + options.addK());
    for (Discounts d : discounts) {
      if (d.values().length > 0) b.metadata("steelyard.discounts." + d.order() + "=" + d.formatted());
    }
    b.metadata("steelyard.corpus.sentences=" + stats[0]);
    b.metadata("steelyard.corpus.tokens=" + stats[2]);
    b.metadata("steelyard.corpus.unk_tokens=" + stats[3]);
    for (int i = 0; i < warnings.size(); i++) b.metadata("steelyard.warning." + (i + 1) + "=" + warnings.get(i));
  }

  private static double seconds(long startNanos) {
    return (System.nanoTime() - startNanos) / 1e9;
  }
}
