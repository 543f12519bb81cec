package steelyard.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Iterator;
import java.util.NoSuchElementException;
import java.util.SplittableRandom;
import java.util.zip.GZIPOutputStream;

/**
 * A seeded synthetic corpus for benchmarks: words drawn independently from a Zipf distribution
 * (P(rank r) ∝ r^−exponent over {@code vocab} words), grouped into sentences of 4 … 26 tokens (mean 15).
 *
 * <p>Word strings are pronounceable syllable strings derived from the rank (rank 0 = most frequent), so the
 * same rank always has the same spelling; all spellings are distinct and lower-case ASCII. The same
 * arguments always produce the same text. Sampling: a cumulative {@code double[vocab]} (8 bytes per word)
 * searched by bisection.
 */
public final class ZipfCorpus implements Iterator<String> {
  private static final String CONSONANTS = "bdfgklmnprstvz";
  private static final String VOWELS = "aeiou";

  private final String[] words;
  private final double[] cumulative;
  private final SplittableRandom random;
  private final long tokens;
  private long emitted;
  private final StringBuilder line = new StringBuilder(256);

  /** Sentences totalling (at least, at most one sentence more than) {@code tokens} tokens. */
  public ZipfCorpus(long tokens, int vocab, double exponent, long seed) {
    if (vocab < 1) throw new IllegalArgumentException("vocab must be >= 1: " + vocab);
    this.tokens = tokens;
    this.words = new String[vocab];
    for (int r = 0; r < vocab; r++) words[r] = spell(r);
    this.cumulative = new double[vocab];
    double sum = 0;
    for (int r = 0; r < vocab; r++) {
      sum += Math.pow(r + 1, -exponent);
      cumulative[r] = sum;
    }
    for (int r = 0; r < vocab; r++) cumulative[r] /= sum;
    this.random = new SplittableRandom(seed);
  }

  /** Writes the corpus, one sentence per line, to {@code out} ({@code .gz} name: gzip). */
  public static void write(Path out, long tokens, int vocab, double exponent, long seed) {
    ZipfCorpus corpus = new ZipfCorpus(tokens, vocab, exponent, seed);
    try (OutputStream raw = Files.newOutputStream(out);
        OutputStream os = out.toString().endsWith(".gz") ? new GZIPOutputStream(raw, 1 << 16) : raw;
        BufferedWriter w = new BufferedWriter(new OutputStreamWriter(os, StandardCharsets.UTF_8), 1 << 16)) {
      while (corpus.hasNext()) {
        w.write(corpus.next());
        w.write('\n');
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** The spelling of the word of rank {@code rank}. */
  public static String spell(int rank) {
    StringBuilder sb = new StringBuilder();
    int r = rank;
    do {
      int syllable = r % (CONSONANTS.length() * VOWELS.length());
      sb.append(CONSONANTS.charAt(syllable / VOWELS.length())).append(VOWELS.charAt(syllable % VOWELS.length()));
      r /= CONSONANTS.length() * VOWELS.length();
    } while (r > 0);
    return sb.toString();
  }

  /** The rank of the next random word. */
  public int nextRank() {
    int i = Arrays.binarySearch(cumulative, random.nextDouble());
    return Math.min(i >= 0 ? i : -i - 1, words.length - 1);
  }

  @Override
  public boolean hasNext() {
    return emitted < tokens;
  }

  @Override
  public String next() {
    if (!hasNext()) throw new NoSuchElementException();
    int length = 4 + random.nextInt(23);
    line.setLength(0);
    for (int i = 0; i < length; i++) {
      if (i > 0) line.append(' ');
      line.append(words[nextRank()]);
    }
    emitted += length;
    return line.toString();
  }
}
