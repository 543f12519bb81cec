package steelyard.history;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.SplittableRandom;
import steelyard.eval.Bootstrap;
import steelyard.eval.EditCounts;
import steelyard.text.Unit;

/** Invented runs of the Tallowmere cooperative's voice logs for the history tests. */
final class HistoryFixtures {
  static final Instant T0 = Instant.parse("2026-12-02T09:00:00.123Z");

  private HistoryFixtures() {}

  static Clock at(Instant t) {
    return Clock.fixed(t, ZoneOffset.UTC);
  }

  /** Writes {@code text} to {@code dir/name} and returns the path. */
  static Path file(Path dir, String name, String text) throws IOException {
    Path p = dir.resolve(name);
    Files.writeString(p, text);
    return p;
  }

  /** Seeded per-utterance rows: {@code n} scored utterances, 1–12 reference tokens, errors 0–3. */
  static UtteranceCounts rows(long seed, int n) {
    SplittableRandom rnd = new SplittableRandom(seed);
    UtteranceCounts.Builder b = new UtteranceCounts.Builder(n);
    for (int i = 0; i < n; i++) b.add(String.format("tpc-v-%04d", i), UtteranceStatus.SCORED, rnd.nextInt(4), 1 + rnd.nextInt(12));
    return b.build();
  }

  /** Sums the included rows into C/S/D/I, putting every error down as a substitution where it fits, else an insertion. */
  static EditCounts totals(UtteranceCounts u) {
    long c = 0;
    long s = 0;
    long i = 0;
    for (int r = 0; r < u.size(); r++) {
      if (!u.status(r).included()) continue;
      int sub = Math.min(u.errors(r), u.referenceTokens(r));
      s += sub;
      i += u.errors(r) - sub;
      c += u.referenceTokens(r) - sub;
    }
    return new EditCounts(c, s, 0, i);
  }

  /** A score-like run on {@code refs} with the given rows, started at {@code start}, taking 1.5 s. */
  static RunRecord.Builder scoreRun(Path refs, String method, UtteranceCounts rows, Instant start) {
    return RunRecord.builder("score", start, at(start.plusMillis(1500)))
        .commandLine(java.util.List.of("score", "--refs", refs.toString()))
        .method(method)
        .unit(Unit.WORD, "nfkc fold-case")
        .totals(totals(rows))
        .utterances(rows)
        .interval(new Bootstrap.Interval(0.1, 0.2), 1000, 20261202L)
        .input(InputFile.REFERENCES, refs, rows.size());
  }
}
