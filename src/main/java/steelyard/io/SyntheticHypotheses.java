package steelyard.io;

import java.io.IOException;
import java.io.OutputStream;
import java.io.Writer;
import java.nio.file.Path;
import java.util.SplittableRandom;
import java.util.zip.GZIPOutputStream;

/**
 * Seeded generator of large hypotheses files for benchmarks and big-input checks: N-best lists of invented
 * warehouse voice notes ("three crates of apples to bay four before noon …"), about 15 tokens each, with
 * columns {@code utt_id,rank,text,acoustic,lm}. Rank 1 is the sentence itself; lower ranks swap a few words
 * for plausible confusions; {@code acoustic} falls with rank (natural log, higher is better) and {@code lm}
 * is noisy. The same arguments always give byte-identical files; scores use a fixed two-decimal format.
 *
 * <pre>{@code
 * SyntheticHypotheses.write(Path.of("big.csv.gz"), 1_000_000, 20, 7L);  // 50 000 utterances × 20
 * }</pre>
 */
public final class SyntheticHypotheses {
  private static final String[] COUNTS = {"one", "two", "three", "four", "five", "six", "seven", "eight", "nine", "ten", "twelve", "twenty"};
  private static final String[] PRODUCE = {"apples", "pears", "onions", "potatoes", "carrots", "cabbages", "plums", "leeks", "beets", "lemons"};
  private static final String[] CONTAINERS = {"crates", "pallets", "boxes", "sacks", "trays", "bins"};
  private static final String[] PLACES = {"bay", "dock", "aisle", "cold room", "loading door"};
  private static final String[] TIMES = {"before noon", "after the morning run", "by six", "at half past two", "first thing tomorrow", "on the late shift"};
  private static final String[] VERBS = {"move", "load", "send", "check", "stack", "hold"};
  private static final String[] NOTES = {"mark them fragile", "two are short", "the seal is broken", "count again please", "driver is waiting", "keep them chilled"};
  /** Confusable word pairs: a hypothesis below rank 1 swaps words along these. */
  private static final String[][] CONFUSIONS = {
    {"two", "to"}, {"four", "for"}, {"eight", "late"}, {"pears", "pairs"}, {"crates", "grates"}, {"bay", "day"},
    {"dock", "dark"}, {"sacks", "sax"}, {"leeks", "leaks"}, {"plums", "plumbs"}, {"load", "low"}, {"nine", "night"},
    {"six", "sticks"}, {"beets", "beats"}, {"stack", "stuck"}, {"the", "a"}, {"them", "him"}, {"ten", "then"}
  };

  private SyntheticHypotheses() {}

  /**
   * Writes about {@code rows} rows ({@code ceil(rows / perUtterance)} utterances × {@code perUtterance}
   * hypotheses, the last one cut to match) to {@code target} atomically; gzipped when the name ends in
   * {@code .gz}. Returns the number of rows written.
   */
  public static long write(Path target, long rows, int perUtterance, long seed) {
    long[] written = new long[1];
    AtomicOutput.writeBytes(target, out -> {
      OutputStream o = InputFiles.isGzipName(target) ? new GZIPOutputStream(out, 1 << 16) : out;
      Writer w = new java.io.BufferedWriter(new java.io.OutputStreamWriter(o, java.nio.charset.StandardCharsets.UTF_8), 1 << 16);
      written[0] = write(w, rows, perUtterance, seed);
      w.flush();
      if (o instanceof GZIPOutputStream g) g.finish();
    });
    return written[0];
  }

  /** Writes the header and {@code rows} rows to {@code out} (not closed); returns {@code rows}. */
  public static long write(Writer out, long rows, int perUtterance, long seed) throws IOException {
    if (rows < 0 || perUtterance < 1) throw new IllegalArgumentException("rows >= 0 and perUtterance >= 1 required");
    SplittableRandom rnd = new SplittableRandom(seed);
    out.write("utt_id,rank,text,acoustic,lm\n");
    StringBuilder sb = new StringBuilder(256);
    String[] words = new String[32];
    long done = 0;
    for (long utt = 1; done < rows; utt++) {
      int n = sentence(rnd, words);
      double base = -40.0 * n - 200 * rnd.nextDouble();
      for (int rank = 1; rank <= perUtterance && done < rows; rank++, done++) {
        sb.setLength(0);
        sb.append("warehouse-").append(utt).append(',').append(rank).append(',');
        appendVariant(sb, words, n, rank, rnd);
        sb.append(',');
        fixed2(sb, base - 1.5 * (rank - 1) - 3 * rnd.nextDouble());
        sb.append(',');
        fixed2(sb, -2.3 * n - 8 * rnd.nextDouble());
        sb.append('\n');
        out.append(sb);
      }
    }
    return done;
  }

  /** Fills {@code words} with one voice note of roughly 15 tokens; returns its length. */
  private static int sentence(SplittableRandom rnd, String[] words) {
    int n = 0;
    n = put(words, n, pick(rnd, VERBS));
    n = put(words, n, pick(rnd, COUNTS));
    n = put(words, n, pick(rnd, CONTAINERS));
    n = put(words, n, "of");
    n = put(words, n, pick(rnd, PRODUCE));
    n = put(words, n, "to");
    n = put(words, n, pick(rnd, PLACES));
    n = put(words, n, pick(rnd, COUNTS));
    n = put(words, n, pick(rnd, TIMES));
    if (rnd.nextInt(3) > 0) n = put(words, n, pick(rnd, NOTES));
    return n;
  }

  private static int put(String[] words, int n, String phrase) {
    int start = 0;
    for (int i = 0; i <= phrase.length(); i++) {
      if (i == phrase.length() || phrase.charAt(i) == ' ') {
        words[n++] = phrase.substring(start, i);
        start = i + 1;
      }
    }
    return n;
  }

  /** Rank 1 is the note itself; rank r alters about r/3 + 1 words (confusion, deletion, insertion) (deterministic per seed). */
  private static void appendVariant(StringBuilder sb, String[] words, int n, int rank, SplittableRandom rnd) {
    int swaps = rank == 1 ? 0 : 1 + rank / 3;
    long mask = 0;
    for (int s = 0; s < swaps; s++) mask |= 1L << rnd.nextInt(n);
    int start = sb.length();
    for (int i = 0; i < n; i++) {
      String w = (mask & (1L << i)) != 0 ? confuse(words[i], rnd) : words[i];
      if (w.isEmpty()) continue;
      if (sb.length() > start) sb.append(' ');
      sb.append(w);
    }
  }

  private static String confuse(String w, SplittableRandom rnd) {
    for (String[] pair : CONFUSIONS) {
      if (pair[0].equals(w)) return pair[1];
      if (pair[1].equals(w)) return pair[0];
    }
    switch (rnd.nextInt(3)) {
      case 0: return "";          // deleted
      case 1: return "uh " + w;   // hesitation inserted
      default: return w + " " + w; // repeated
    }
  }

  private static String pick(SplittableRandom rnd, String[] options) {
    return options[rnd.nextInt(options.length)];
  }

  /** Appends {@code v} rounded half-up to two decimals, locale-free ({@code -123.45}). */
  static void fixed2(StringBuilder sb, double v) {
    long cents = Math.round(v * 100);
    if (cents < 0) {
      sb.append('-');
      cents = -cents;
    }
    sb.append(cents / 100).append('.');
    long frac = cents % 100;
    if (frac < 10) sb.append('0');
    sb.append(frac);
  }

  /** {@code SyntheticHypotheses FILE ROWS [PER_UTTERANCE=20] [SEED=1]}: writes a file and prints its row count. */
  public static void main(String[] args) {
    if (args.length < 2) {
      System.err.println("arguments: FILE ROWS [PER_UTTERANCE] [SEED]");
      System.exit(2);
    }
    int per = args.length > 2 ? Integer.parseInt(args[2]) : 20;
    long seed = args.length > 3 ? Long.parseLong(args[3]) : 1L;
    long n = write(Path.of(args[0]), Long.parseLong(args[1]), per, seed);
    System.out.println(n + " rows written to " + args[0] + " (seed " + seed + ")");
  }
}
