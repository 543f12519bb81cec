package steelyard.lm.arpa;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import steelyard.io.InputException;
import steelyard.io.InputFiles;
import steelyard.lm.BackoffModel;
import steelyard.lm.LoadProgress;
import steelyard.lm.ModelMetadata;

/**
 * Reads an ARPA back-off model (log10 probabilities) into a {@link BackoffModel}.
 *
 * <p>Accepted: any order 1 … 6; text before {@code \data\} (lines starting with {@code #} become metadata
 * lines, see {@link ModelMetadata}); blank lines anywhere; a missing back-off field (weight 1, log10 0);
 * {@code <s>} with the customary −99; n-grams whose prefix is not listed (a pruned file: the prefix becomes
 * a context-only entry with back-off 0); no {@code <unk>} unigram (a closed-vocabulary model: out-of-vocabulary
 * tokens get the floor given to the reader, and a warning is passed to the warning sink); anything after
 * {@code \end\} is ignored. Every other irregularity is an {@link InputException} naming file and line.
 *
 * <p>Cost: one pass, no regular expressions; fields are located by hand and numbers converted by a decimal
 * fast path. Memory is that of the resulting {@link BackoffModel}.
 */
public final class ArpaReader {
  private static final String EXPECTED_ENTRY = "'log10prob w1 … wk [log10backoff]' separated by spaces or tabs";

  private final Path file;
  private final double unknownFloorLog10;
  private final Consumer<String> warnings;
  private final LoadProgress progress;
  private long lineNo;
  /** The previous entry line of the current section and its field offsets (null at a section start). */
  private String prevLine;
  private final int[] prevStarts = new int[8];
  private final int[] prevEnds = new int[8];

  private ArpaReader(Path file, double unknownFloorLog10, Consumer<String> warnings, LoadProgress progress) {
    this.file = file;
    this.unknownFloorLog10 = unknownFloorLog10;
    this.warnings = warnings;
    this.progress = progress;
  }

  /** Reads {@code file} (gzip when its name ends in {@code .gz}); warnings (closed vocabulary) go to {@code warnings}. */
  public static BackoffModel read(Path file, double unknownFloorLog10, Consumer<String> warnings, LoadProgress progress) {
    ArpaReader r = new ArpaReader(file, unknownFloorLog10, warnings, progress);
    try (BufferedReader in = InputFiles.open(file)) {
      return r.parse(in);
    } catch (java.io.EOFException e) {
      throw InputException.at(file, r.lineNo + 1, "compressed data ends early (truncated gzip)", "a complete gzip file").withCause(e);
    } catch (CharacterCodingException e) {
      throw InputException.at(file, r.lineNo + 1, "not UTF-8 text (binary data?)", "an ARPA text file").withCause(e);
    } catch (IOException e) {
      throw InputException.at(file, r.lineNo + 1, "cannot read (" + e.getMessage() + ")", "a readable, complete file").withCause(e);
    }
  }

  private String next(BufferedReader in) throws IOException {
    String line = in.readLine();
    if (line == null) return null;
    lineNo++;
    if (line.indexOf('\0') >= 0) {
      throw InputException.at(file, lineNo, "binary data (NUL character)", "an ARPA text file");
    }
    return line;
  }

  private BackoffModel parse(BufferedReader in) throws IOException {
    List<String> metadata = new ArrayList<>();
    String line;
    while (true) {
      line = next(in);
      if (line == null && lineNo == 0) throw InputException.inFile(file, "empty file", "an ARPA model file");
      if (line == null) throw InputException.at(file, Math.max(1, lineNo), "no \\data\\ line found", "an ARPA file starting with \\data\\ (after optional comment lines)");
      String t = line.strip();
      if (t.equals("\\data\\")) break;
      if (t.startsWith("#")) metadata.add(t.substring(1).strip());
      else if (!t.isEmpty()) metadata.add(t);
    }
    long[] counts = readCounts(in);
    int order = counts.length;
    BackoffModel.Builder b = ModelMetadata.builder(order, metadata);
    for (String m : metadata) b.metadata(m);
    long total = 0;
    for (int k = 1; k <= order; k++) {
      // Presize from \data\, capped: a damaged count must not allocate gigabytes before the sections disagree.
      b.expectEntries(k, (int) Math.min(counts[k - 1], 1 << 22));
      total += counts[k - 1];
    }
    if (progress != null) progress.start(total);
    readSections(in, b, counts);
    if (progress != null) progress.end();
    int unk = b.tokenId(BackoffModel.UNKNOWN);
    if (!b.contains(new int[] {unk})) {
      b.unknownFloorLog10(unknownFloorLog10);
      if (warnings != null) {
        warnings.accept(file + ": no <unk> unigram (closed-vocabulary model); out-of-vocabulary tokens get log10 P = "
            + unknownFloorLog10 + " (--oov-log10-prob)");
      }
    }
    return b.build();
  }

  /** Reads {@code ngram k=count} lines up to the first section header (left for readSections via pending). */
  private long[] readCounts(BufferedReader in) throws IOException {
    List<Long> counts = new ArrayList<>();
    while (true) {
      String line = next(in);
      if (line == null) throw truncated("inside \\data\\");
      String t = line.strip();
      if (t.isEmpty()) continue;
      if (t.startsWith("\\")) {
        pending = t;
        break;
      }
      if (!t.startsWith("ngram ")) throw InputException.at(file, lineNo, "unexpected line in \\data\\: '" + clip(t) + "'", "'ngram k=count' lines");
      int eq = t.indexOf('=');
      String k = eq < 0 ? "" : t.substring(6, eq).strip();
      String c = eq < 0 ? "" : t.substring(eq + 1).strip();
      int order = parseCount(k, t);
      long count = parseCount(c, t);
      if (order != counts.size() + 1) {
        throw InputException.at(file, lineNo, "count line for order " + order + " after " + counts.size() + " count lines",
            "'ngram " + (counts.size() + 1) + "=count' next");
      }
      if (order > 6) throw InputException.at(file, lineNo, "order " + order + " is not supported", "orders 1 to 6");
      counts.add(count);
    }
    if (counts.isEmpty()) throw InputException.at(file, lineNo, "\\data\\ lists no n-gram counts", "'ngram 1=count' lines after \\data\\");
    long[] out = new long[counts.size()];
    for (int i = 0; i < out.length; i++) out[i] = counts.get(i);
    return out;
  }

  private String pending;

  private int parseCount(String s, String line) {
    if (s.isEmpty() || s.length() > 10) throw badCount(line);
    long v = 0;
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      if (c < '0' || c > '9') throw badCount(line);
      v = v * 10 + (c - '0');
    }
    if (v > Integer.MAX_VALUE - 8) throw badCount(line);
    return (int) v;
  }

  private InputException badCount(String line) {
    return InputException.at(file, lineNo, "bad count line '" + clip(line) + "'", "'ngram k=count' with whole numbers");
  }

  private void readSections(BufferedReader in, BackoffModel.Builder b, long[] counts) throws IOException {
    int order = counts.length;
    int[] starts = new int[order + 2];
    int[] ends = new int[order + 2];
    int[] ids = new int[0];
    String header = pending;
    long done = 0;
    for (int k = 1; k <= order; k++) {
      String want = "\\" + k + "-grams:";
      if (header == null) throw truncated("before section " + want);
      if (!header.equals(want)) {
        if (header.equals("\\end\\")) throw InputException.at(file, lineNo, "missing section " + want, want + " (\\data\\ announces " + order + " orders)");
        throw InputException.at(file, lineNo, "unexpected section header '" + clip(header) + "'", want);
      }
      if (ids.length != k) ids = new int[k];
      prevLine = null;
      long seen = 0;
      header = null;
      String line;
      while ((line = next(in)) != null) {
        int n = ArpaText.split(line, starts, ends);
        if (n == 0) continue;
        if (line.charAt(starts[0]) == '\\') {
          header = line.strip();
          break;
        }
        if (seen == counts[k - 1]) {
          throw InputException.at(file, lineNo, "more " + k + "-grams than the " + counts[k - 1] + " announced in \\data\\",
              "the count in \\data\\ to match the section");
        }
        addEntry(b, line, k, order, n, starts, ends, ids);
        seen++;
        if (progress != null && (++done & 0xffff) == 0) progress.step(done);
      }
      if (seen < counts[k - 1]) {
        if (header == null) throw truncated("in section " + want + " after " + seen + " of " + counts[k - 1] + " announced n-grams");
        throw InputException.at(file, lineNo, "section " + want + " has " + seen + " n-grams but \\data\\ announced " + counts[k - 1],
            "the count in \\data\\ to match the section");
      }
    }
    if (header == null) throw truncated("without \\end\\");
    if (!header.equals("\\end\\")) {
      throw InputException.at(file, lineNo, "unexpected section header '" + clip(header) + "'", "\\end\\ after the " + order + "-grams (\\data\\ announces " + order + " orders)");
    }
  }

  private void addEntry(BackoffModel.Builder b, String line, int k, int order, int n, int[] starts, int[] ends, int[] ids) {
    if (n < k + 1 || n > k + 2) throw wrongOrder(line, k, n - 1);
    double p = ArpaText.parseNumber(line, starts[0], ends[0]);
    if (Double.isNaN(p)) {
      throw InputException.at(file, lineNo, "bad log10 probability '" + clip(line.substring(starts[0], ends[0])) + "'", "a finite decimal number");
    }
    if (p > 0) {
      throw InputException.at(file, lineNo, "positive log10 probability " + line.substring(starts[0], ends[0]), "a log10 probability <= 0");
    }
    double bow = 0;
    if (n == k + 2) {
      bow = ArpaText.parseNumber(line, starts[k + 1], ends[k + 1]);
      if (Double.isNaN(bow)) {
        char c = line.charAt(starts[k + 1]);
        boolean numeric = (c >= '0' && c <= '9') || c == '-' || c == '+' || c == '.';
        if (!numeric) throw wrongOrder(line, k, k + 1);
        throw InputException.at(file, lineNo, "bad log10 back-off weight '" + clip(line.substring(starts[k + 1], ends[k + 1])) + "'", "a finite decimal number");
      }
    }
    // ids still holds the previous line's ids: files are grouped by context, so most words repeat in place.
    for (int j = 0; j < k; j++) {
      int from = starts[j + 1];
      int len = ends[j + 1] - from;
      if (prevLine != null && prevEnds[j + 1] - prevStarts[j + 1] == len && line.regionMatches(from, prevLine, prevStarts[j + 1], len)) continue;
      ids[j] = b.tokenId(line.substring(from, from + len));
    }
    prevLine = line;
    System.arraycopy(starts, 0, prevStarts, 0, k + 1);
    System.arraycopy(ends, 0, prevEnds, 0, k + 1);
    if (!b.add(ids, p, bow)) {
      throw InputException.at(file, lineNo, "duplicate " + k + "-gram '" + clip(line.substring(starts[1], ends[k])) + "'", "each n-gram listed once");
    }
  }

  private InputException wrongOrder(String line, int k, int words) {
    return InputException.at(file, lineNo, "n-gram of the wrong order in section \\" + k + "-grams: ('" + clip(line.strip()) + "' has "
        + Math.max(0, words) + " fields after the probability)", EXPECTED_ENTRY + " with k = " + k);
  }

  private InputException truncated(String where) {
    return InputException.at(file, Math.max(1, lineNo), "file ends " + where + " (truncated?)", "the sections announced in \\data\\ and a final \\end\\");
  }

  private static String clip(String s) {
    return s.length() <= 60 ? s : s.substring(0, 57) + "...";
  }
}
