package steelyard.history;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import steelyard.eval.MissingHypothesisPolicy;
import steelyard.eval.PairedComparison;
import steelyard.eval.Pick;
import steelyard.io.InputException;
import steelyard.report.CompareReport;

/**
 * Two stored runs compared as {@code compare} compares two systems on the files: the common set is the
 * utterances both runs count, in run A's row order (reference-file order), and the statistics come from the same
 * {@link PairedComparison#of(int[], int[], int[], int, long, int)}, so the same seed gives the same intervals and
 * p-value as {@code compare} on the original files.
 *
 * <p>Refused ({@link InputException}): runs on different references (the two SHA-256 are named), in different
 * units, or counting an utterance's reference tokens differently (a different normalisation).
 */
final class RunComparison {
  private RunComparison() {}

  /** @param names display names of A and B; null for the runs' labels, else {@code run ID} */
  static CompareReport.CompareRun compare(Path file, StoredRun a, StoredRun b, List<String> names, int resamples, long seed, int threads) {
    RunRecord ra = a.run();
    RunRecord rb = b.run();
    checkComparable(file, a, b);
    List<String> display = names != null ? names : defaultNames(a, b);
    IntArrayList errA = new IntArrayList();
    IntArrayList errB = new IntArrayList();
    IntArrayList ref = new IntArrayList();
    commonSet(file, a, b, errA, errB, ref);
    PairedComparison c = PairedComparison.of(errA.toIntArray(), errB.toIntArray(), ref.toIntArray(), resamples, seed, threads);
    List<String> warnings = new ArrayList<>();
    if (!Objects.equals(ra.normalisation(), rb.normalisation()))
      warnings.add("runs " + a.id() + " and " + b.id() + " were normalised differently: '" + ra.normalisation() + "' and '"
          + rb.normalisation() + "'");
    return new CompareReport.CompareRun(ra.inputPath(InputFile.REFERENCES), ra.unit(), Objects.requireNonNullElse(ra.normalisation(), ""),
        system(display.get(0), ra), system(display.get(1), rb), c, seed, List.of(), warnings);
  }

  private static void checkComparable(Path file, StoredRun a, StoredRun b) {
    String da = a.run().dataSha256();
    String db = b.run().dataSha256();
    for (StoredRun s : List.of(a, b))
      if (s.run().dataSha256() == null)
        throw InputException.inFile(file, "run " + s.id() + " has no references, so it has no errors to compare",
            "two runs scored against the same references");
    if (!da.equals(db))
      throw InputException.inFile(file, "runs " + a.id() + " and " + b.id() + " were scored on different reference data (sha256 "
          + da + " and " + db + ")", "two runs on the same references file");
    if (a.run().unit() != b.run().unit())
      throw InputException.inFile(file, "runs " + a.id() + " and " + b.id() + " count different units ("
          + a.run().unit() + " and " + b.run().unit() + ")", "two runs in the same unit");
  }

  // The utterances both runs count, in A's row order, with A's reference tokens (as compare uses).
  private static void commonSet(Path file, StoredRun a, StoredRun b, IntArrayList errA, IntArrayList errB, IntArrayList ref) {
    UtteranceCounts ua = a.run().utterances();
    UtteranceCounts ub = b.run().utterances();
    Object2IntOpenHashMap<String> rowOfB = new Object2IntOpenHashMap<>(ub.size());
    rowOfB.defaultReturnValue(-1);
    for (int r = 0; r < ub.size(); r++) rowOfB.put(ub.uttId(r), r);
    for (int r = 0; r < ua.size(); r++) {
      int rb = rowOfB.getInt(ua.uttId(r));
      if (!ua.status(r).included() || rb < 0 || !ub.status(rb).included()) continue;
      if (ua.referenceTokens(r) != ub.referenceTokens(rb))
        throw InputException.inFile(file, "utterance '" + ua.uttId(r) + "' has " + ua.referenceTokens(r) + " reference tokens in run "
            + a.id() + " and " + ub.referenceTokens(rb) + " in run " + b.id() + ": the runs normalised the references differently",
            "two runs with the same normalisation options and rules");
      errA.add(ua.errors(r));
      errB.add(ub.errors(rb));
      ref.add(ua.referenceTokens(r));
    }
  }

  private static List<String> defaultNames(StoredRun a, StoredRun b) {
    String la = a.run().label();
    String lb = b.run().label();
    if (la != null && lb != null && !la.equals(lb)) return List.of(la, lb);
    return List.of("run " + a.id(), "run " + b.id());
  }

  private static CompareReport.SystemRun system(String name, RunRecord r) {
    UtteranceCounts u = r.utterances();
    List<String> missing = missingInRowOrder(u);
    CompareReport.SystemScore score = new CompareReport.SystemScore(pick(r.method()),
        Objects.requireNonNullElse(r.missingPolicy(), MissingHypothesisPolicy.ALL_DELETIONS), r.totals(), u.includedCount(),
        u.includedWithErrors(), missing, u.idsWith(UtteranceStatus.NO_REFERENCE), r.warnings());
    String hyps = r.inputPath(InputFile.HYPOTHESES);
    return new CompareReport.SystemRun(name, hyps == null ? "" : hyps, score);
  }

  private static List<String> missingInRowOrder(UtteranceCounts u) {
    List<String> out = new ArrayList<>();
    for (int r = 0; r < u.size(); r++) {
      UtteranceStatus s = u.status(r);
      if (s == UtteranceStatus.MISSING_HYPOTHESIS || s == UtteranceStatus.MISSING_EXCLUDED) out.add(u.uttId(r));
    }
    return out;
  }

  // The pick of a scoring run; a rescoring run's method (nbest, mbr, …) chose per utterance.
  private static Pick pick(String method) {
    for (Pick p : Pick.values()) if (p.label().equals(method)) return p;
    return Pick.GIVEN;
  }
}
