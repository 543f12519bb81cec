package steelyard.eval;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.function.Function;
import java.util.function.ToIntFunction;
import steelyard.io.Hypothesis;
import steelyard.io.Reference;
import steelyard.io.UtteranceHypotheses;
import steelyard.text.TokenSequence;
import steelyard.text.Vocabulary;

/**
 * Scores a stream of N-best utterances against references: one hypothesis per utterance chosen by a
 * {@link Pick}, aligned by {@link Aligner}, summed into corpus, group and per-utterance counts.
 *
 * <p>Hypotheses are consumed one utterance at a time; what is kept per utterance is the compact
 * {@link UtteranceScores} row (picked hypothesis text only when {@link Settings#keepTexts()}), plus the shared
 * {@link Vocabulary} of distinct tokens and the error tallies. References are held whole (they come as a map).
 *
 * <p>Counting rules: N counts the reference's non-optional tokens; an empty reference contributes its
 * insertions; a hypothesis utterance without a reference is listed in {@link CorpusScore#missingReferences()}
 * and not scored; a reference without hypotheses is listed in {@link CorpusScore#missingHypotheses()} and
 * counted according to the {@link MissingHypothesisPolicy}. Single-threaded and deterministic: the same inputs
 * give the same result.
 */
public final class CorpusScorer {
  /**
   * Largest alignment table (cells) built for the frequent-error lists: 16 M cells = 64 MB. Longer pairs are
   * still counted exactly (same tie-breaking) but left out of those lists, with a warning.
   */
  static final long MAX_TABLE_CELLS = 16L << 20;

  /**
   * @param pick      which hypothesis is scored per utterance
   * @param missing   how an utterance without a hypothesis counts
   * @param topK      how many substitution pairs, deleted and inserted tokens to list
   * @param keepTexts whether the per-utterance table keeps the picked hypothesis text (for a CSV table)
   */
  public record Settings(Pick pick, MissingHypothesisPolicy missing, int topK, boolean keepTexts) {
    public Settings {
      if (topK < 0) throw new IllegalArgumentException("topK must be >= 0: " + topK);
    }
  }

  private final Function<String, TokenSequence> tokeniser;
  private final Settings settings;

  /**
   * @param tokeniser turns raw reference or hypothesis text into normalised tokens (the same for both sides),
   *                  e.g. {@code raw -> normaliser.tokens(raw, unit)}
   */
  public CorpusScorer(Function<String, TokenSequence> tokeniser, Settings settings) {
    this.tokeniser = tokeniser;
    this.settings = settings;
  }

  /** Scores all of {@code hyps} against {@code refs} (iteration order of {@code refs} = table order). */
  public CorpusScore score(Map<String, Reference> refs, Iterator<UtteranceHypotheses> hyps) {
    if (settings.pick() == Pick.GIVEN) throw new IllegalArgumentException("Pick.GIVEN needs a chooser");
    return new Run(refs, null).score(hyps);
  }

  /**
   * Scores the hypothesis that {@code chooser} picks per utterance (an index into
   * {@link UtteranceHypotheses#hypotheses()}, e.g. a rescoring's choice); the settings' pick must be
   * {@link Pick#GIVEN}.
   */
  public CorpusScore score(Map<String, Reference> refs, Iterator<UtteranceHypotheses> hyps, ToIntFunction<UtteranceHypotheses> chooser) {
    if (settings.pick() != Pick.GIVEN) throw new IllegalArgumentException("a chooser needs Pick.GIVEN, not " + settings.pick());
    return new Run(refs, chooser).score(hyps);
  }

  /** Token ids and optional flags (null when none is optional) of one text. */
  private record Tokens(int[] ids, boolean[] optional) {}

  private final class Run {
    private final Reference[] refs;
    private final Object2IntOpenHashMap<String> rowOf = new Object2IntOpenHashMap<>();
    private final UtteranceScores table;
    private final Vocabulary vocab = new Vocabulary();
    private final Aligner aligner = new Aligner();
    private final ErrorTallies tallies = new ErrorTallies();
    private final List<String> missingRefs = new ArrayList<>();
    private final List<String> warnings = new ArrayList<>();
    private final List<String> untallied = new ArrayList<>();
    private final ToIntFunction<UtteranceHypotheses> chooser;

    Run(Map<String, Reference> refMap, ToIntFunction<UtteranceHypotheses> chooser) {
      this.chooser = chooser;
      refs = refMap.values().toArray(new Reference[0]);
      String[] ids = new String[refs.length];
      String[] texts = new String[refs.length];
      rowOf.defaultReturnValue(-1);
      for (int r = 0; r < refs.length; r++) {
        ids[r] = refs[r].uttId();
        texts[r] = refs[r].text();
        rowOf.put(ids[r], r);
      }
      table = new UtteranceScores(ids, texts);
    }

    CorpusScore score(Iterator<UtteranceHypotheses> hyps) {
      while (hyps.hasNext()) scoreUtterance(hyps.next());
      List<String> missingHyps = countMissing();
      return summarise(missingHyps);
    }

    private void scoreUtterance(UtteranceHypotheses u) {
      int row = rowOf.getInt(u.uttId());
      if (row < 0) {
        missingRefs.add(u.uttId());
        return;
      }
      if (table.status[row] != UtteranceScores.UNSEEN)
        throw new IllegalArgumentException("utterance " + u.uttId() + " given twice");
      Reference ref = refs[row];
      Tokens r = tokens(ref.text());
      Hypothesis chosen = chooser == null ? u.first() : u.hypotheses().get(chooser.applyAsInt(u));
      Tokens h = tokens(chosen.text());
      if (settings.pick() == Pick.ORACLE) {
        int bestErrors = aligner.measure(r.ids, r.optional, h.ids, h.optional);
        for (int k = 0; k < u.size(); k++) {
          Hypothesis cand = u.hypotheses().get(k);
          if (cand == chosen) continue;
          Tokens ct = tokens(cand.text());
          int e = aligner.measure(r.ids, r.optional, ct.ids, ct.optional);
          if (e < bestErrors || (e == bestErrors && betterRank(cand, k, chosen, u))) {
            chosen = cand;
            h = ct;
            bestErrors = e;
          }
        }
      }
      EditCounts c;
      if ((long) (r.ids.length + 1) * (h.ids.length + 1) <= MAX_TABLE_CELLS) {
        Alignment al = aligner.alignment(r.ids, r.optional, h.ids, h.optional);
        tallies.add(al, r.ids, h.ids);
        c = al.counts();
      } else {
        // Same counts without the full table; only the frequent-error lists miss this utterance.
        aligner.measure(r.ids, r.optional, h.ids, h.optional);
        c = new EditCounts(aligner.lastCorrect(), aligner.lastSubstitutions(), aligner.lastDeletions(), aligner.lastInsertions());
        untallied.add(u.uttId());
      }
      table.set(row, UtteranceScores.SCORED, (int) c.correct(), (int) c.substitutions(), (int) c.deletions(), (int) c.insertions());
      table.groups[row] = !ref.group().isEmpty() ? ref.group() : chosen.group();
      table.hypRank[row] = chosen.rank();
      if (settings.keepTexts()) {
        table.hypTexts[row] = chosen.text();
        table.hypSystems[row] = chosen.system();
      }
    }

    // Ties between equally good hypotheses: smaller rank, then the recogniser's pick, then file order.
    private boolean betterRank(Hypothesis cand, int candIndex, Hypothesis best, UtteranceHypotheses u) {
      if (cand.rank() != best.rank()) return cand.rank() < best.rank();
      if (best == u.first()) return false;
      if (candIndex == u.recognizerPick()) return true;
      return cand.fileOrder() < best.fileOrder();
    }

    private List<String> countMissing() {
      List<String> missing = new ArrayList<>();
      for (int row = 0; row < refs.length; row++) {
        if (table.status[row] != UtteranceScores.UNSEEN) continue;
        missing.add(refs[row].uttId());
        table.groups[row] = refs[row].group();
        if (settings.missing() == MissingHypothesisPolicy.ALL_DELETIONS) {
          Tokens r = tokens(refs[row].text());
          aligner.measure(r.ids, r.optional, new int[0], null);
          tallies.addAllDeleted(r.ids, r.optional);
          table.set(row, UtteranceScores.MISSING_COUNTED, 0, 0, aligner.lastDeletions(), 0);
        } else {
          table.set(row, UtteranceScores.MISSING_EXCLUDED, 0, 0, 0, 0);
        }
      }
      return missing;
    }

    private CorpusScore summarise(List<String> missingHyps) {
      EditCounts totals = EditCounts.ZERO;
      int utts = 0;
      int withErrors = 0;
      TreeMap<String, GroupScore> groups = new TreeMap<>();
      boolean anyGroup = false;
      for (int row = 0; row < table.size(); row++) {
        if (!table.included(row)) continue;
        EditCounts c = table.counts(row);
        int err = c.errors() > 0 ? 1 : 0;
        totals = totals.plus(c);
        utts++;
        withErrors += err;
        String g = table.group(row);
        anyGroup |= !g.isEmpty();
        GroupScore old = groups.get(g);
        groups.put(g, old == null
            ? new GroupScore(g, 1, err, c)
            : new GroupScore(g, old.utterances() + 1, old.sentencesWithErrors() + err, old.counts().plus(c)));
      }
      addWarnings(totals, missingHyps);
      int k = settings.topK();
      return new CorpusScore(
          settings.pick(), settings.missing(), totals, utts, withErrors,
          anyGroup ? new ArrayList<>(groups.values()) : List.of(),
          tallies.topSubstitutions(vocab, k), tallies.topDeletions(vocab, k), tallies.topInsertions(vocab, k),
          table, missingHyps, missingRefs, warnings);
    }

    private void addWarnings(EditCounts totals, List<String> missingHyps) {
      if (!missingHyps.isEmpty()) {
        String how = settings.missing() == MissingHypothesisPolicy.ALL_DELETIONS ? "counted as all deletions" : "excluded from the totals";
        warnings.add(missingHyps.size() + " reference utterance(s) have no hypothesis (" + how + "), first: " + missingHyps.get(0));
      }
      if (!missingRefs.isEmpty())
        warnings.add(missingRefs.size() + " hypothesis utterance(s) have no reference and were not scored, first: " + missingRefs.get(0));
      if (!untallied.isEmpty())
        warnings.add(untallied.size() + " utterance(s) too long for the frequent-error lists (counted in every total), first: " + untallied.get(0));
      if (totals.referenceTokens() == 0)
        warnings.add("the references have no tokens to score (N = 0): the error rate is undefined; " + totals.errors() + " error(s) counted");
    }

    private Tokens tokens(String raw) {
      TokenSequence ts = tokeniser.apply(raw);
      int[] ids = vocab.internAll(ts.tokens());
      boolean[] opt = ts.optional();
      for (boolean b : opt) if (b) return new Tokens(ids, opt);
      return new Tokens(ids, null);
    }
  }
}
