package steelyard.demo;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.function.Supplier;
import steelyard.io.AtomicOutput;
import steelyard.io.OutputSet;
import steelyard.io.InputException;

/**
 * The seeded generator of the bundled demo data of the invented Tallowmere Produce Cooperative: spoken voice
 * logs as N-best lists ({@link SpeechSimulator}), scanned docket lines read by several OCR configurations
 * ({@link OcrSimulator}), their references, and domain text corpora for training the demo language model.
 *
 * <p>Same seed and sizes give byte-identical files: every file draws from its own stream
 * ({@link Dice#derive}), numbers are formatted with {@link Locale#ROOT}, nothing depends on hash iteration order,
 * the clock or the platform. Evaluation sentences are drawn first and never appear in a corpus.
 */
public final class DemoData {
  /** The fixed default seed (the project's default run seed). */
  public static final long DEFAULT_SEED = 20261202L;

  /** How much to generate. */
  public record Sizes(int voiceUtterances, int voiceCorpus, int docketLines, int docketCorpus) {
    /** The checked-in set: 300 voice utterances and 200 docket lines per evaluation set, 30 k + 15 k corpus lines. */
    public static final Sizes DEFAULT = new Sizes(300, 30_000, 200, 15_000);
  }

  private static final int SPEAKERS = 12;

  /** Scoring rules for the voice sets: the hesitations the recogniser inserts are never an error. */
  private static final String VOICE_RULES = """
      # Scoring rules for the voice-log demo sets of the Tallowmere Produce Cooperative (invented).
      # The recogniser inserts hesitations that no reference contains: never an error, present or absent.
      optional uh | um
      """;

  private DemoData() {}

  /** All generated files by file name (sorted), as UTF-8 bytes with LF line ends. */
  public static SortedMap<String, byte[]> generate(long seed, Sizes sizes) {
    SortedMap<String, String> files = new TreeMap<>();
    List<List<String>> voice = distinct(new VoiceGrammar(new Dice(Dice.derive(seed, "voice-sentences")), false)::sentence, 2, sizes.voiceUtterances());
    List<List<String>> dockets = distinct(new DocketGrammar(new Dice(Dice.derive(seed, "docket-lines")))::line, 2, sizes.docketLines());
    SpeechSimulator.Speaker[] speakers = SpeechSimulator.speakers(new Dice(Dice.derive(seed, "speakers")), SPEAKERS);
    String[] sets = {"dev", "test"};
    for (int s = 0; s < sets.length; s++) {
      voiceSet(files, seed, sets[s], voice.get(s), speakers);
      docketSet(files, seed, sets[s], dockets.get(s));
    }
    files.put("corpus-voice.txt", corpus(new VoiceGrammar(new Dice(Dice.derive(seed, "voice-corpus")), true)::sentence, union(voice), sizes.voiceCorpus()));
    files.put("corpus-dockets.txt", corpus(new DocketGrammar(new Dice(Dice.derive(seed, "docket-corpus")))::line, union(dockets), sizes.docketCorpus()));
    files.put("voice.rules", VOICE_RULES);
    files.put("manifest.txt", manifest(seed, sizes, files));
    SortedMap<String, byte[]> bytes = new TreeMap<>();
    for (Map.Entry<String, String> e : files.entrySet()) bytes.put(e.getKey(), e.getValue().getBytes(StandardCharsets.UTF_8));
    return Collections.unmodifiableSortedMap(bytes);
  }

  /**
   * Generates and writes every file into {@code dir} (created if needed), each through {@link AtomicOutput}
   * (temporary file beside the target), all moved into place together at the end ({@link OutputSet}). Returns the paths written, in file-name order.
   *
   * @throws InputException when the directory cannot be created or a file cannot be written
   */
  public static List<Path> write(Path dir, long seed, Sizes sizes) {
    SortedMap<String, byte[]> files = generate(seed, sizes);
    try {
      Files.createDirectories(dir);
    } catch (IOException ex) {
      throw InputException.inFile(dir, "cannot create the output directory (" + ex + ")", "a directory that can be created and written").withCause(ex);
    }
    List<Path> written = new ArrayList<>();
    Map<String, Path> targets = new java.util.LinkedHashMap<>();
    for (String name : files.keySet()) targets.put(name, dir.resolve(name));
    try (OutputSet set = OutputSet.open(targets, List.of())) { // all files or none
      for (Map.Entry<String, byte[]> e : files.entrySet()) {
        Path target = dir.resolve(e.getKey());
        AtomicOutput.writeBytes(target, out -> out.write(e.getValue()));
        written.add(target);
      }
      set.commit();
    }
    return written;
  }

  /** {@code sets} lists of {@code perSet} distinct sentences, no sentence in two lists. */
  private static List<List<String>> distinct(Supplier<String> source, int sets, int perSet) {
    Set<String> seen = new HashSet<>();
    List<List<String>> out = new ArrayList<>();
    for (int s = 0; s < sets; s++) {
      Set<String> set = new LinkedHashSet<>();
      while (set.size() < perSet) {
        String sentence = source.get();
        if (seen.add(sentence)) set.add(sentence);
      }
      out.add(List.copyOf(set));
    }
    return out;
  }

  private static Set<String> union(List<List<String>> sets) {
    Set<String> all = new HashSet<>();
    for (List<String> s : sets) all.addAll(s);
    return all;
  }

  /** {@code count} corpus lines from {@code source}, skipping every evaluation sentence. */
  private static String corpus(Supplier<String> source, Set<String> evaluation, int count) {
    StringBuilder sb = new StringBuilder(count * 48);
    int n = 0;
    while (n < count) {
      String line = source.get();
      if (evaluation.contains(line)) continue;
      sb.append(line).append('\n');
      n++;
    }
    return sb.toString();
  }

  private static void voiceSet(SortedMap<String, String> files, long seed, String set, List<String> refs, SpeechSimulator.Speaker[] speakers) {
    Dice dice = new Dice(Dice.derive(seed, "voice-" + set));
    SpeechSimulator sim = new SpeechSimulator(dice);
    StringBuilder nbest = new StringBuilder(CsvText.row("utt_id", "rank", "text", "acoustic", "lm", "group"));
    StringBuilder refCsv = new StringBuilder(CsvText.row("utt_id", "text", "group"));
    for (int u = 0; u < refs.size(); u++) {
      String id = String.format(Locale.ROOT, "v%s-%04d", set, u + 1);
      SpeechSimulator.Speaker speaker = speakers[dice.below(speakers.length)];
      List<SpeechSimulator.Candidate> hyps = sim.recognise(List.of(SpeechSimulator.splitWords(refs.get(u))), speaker);
      for (int r = 0; r < hyps.size(); r++) {
        SpeechSimulator.Candidate h = hyps.get(r);
        nbest.append(CsvText.row(id, Integer.toString(r + 1), h.text(), CsvText.fixed(h.acoustic(), 4), CsvText.fixed(h.lm(), 4), speaker.id()));
      }
      refCsv.append(CsvText.row(id, refs.get(u), speaker.id()));
    }
    files.put("voice-" + set + ".nbest.csv", nbest.toString());
    files.put("voice-" + set + ".refs.csv", refCsv.toString());
  }

  private static void docketSet(SortedMap<String, String> files, long seed, String set, List<String> lines) {
    Dice dice = new Dice(Dice.derive(seed, "dockets-" + set));
    OcrSimulator sim = new OcrSimulator(dice);
    StringBuilder nbest = new StringBuilder(CsvText.row("utt_id", "rank", "system", "text", "confidence", "mean_word_conf", "group"));
    StringBuilder refCsv = new StringBuilder(CsvText.row("utt_id", "text", "group"));
    int sheet = 0;
    int leftOnSheet = 0;
    double sheetDamage = 1;
    for (int u = 0; u < lines.size(); u++) {
      if (leftOnSheet == 0) {
        sheet++;
        leftOnSheet = dice.between(5, 10);
        sheetDamage = StrictMath.exp(dice.normal(0, 0.45));
      }
      leftOnSheet--;
      String id = String.format(Locale.ROOT, "d%s-%04d", set, u + 1);
      String group = String.format(Locale.ROOT, "sheet%02d", sheet);
      String ref = lines.get(u);
      double damage = sheetDamage * StrictMath.exp(dice.normal(0, 0.5));
      String smudged = sim.smudge(ref, damage);
      int shared = smudged.equals(ref) ? 0 : 1;
      List<OcrSimulator.Reading> readings = new ArrayList<>();
      for (OcrSimulator.Profile p : OcrSimulator.PROFILES) readings.add(sim.read(p, smudged, damage, shared));
      // Each configuration's one reading is its own best (rank 1); rows go most confident first, so the
      // recogniser's choice (smallest rank, ties by file order) is the most confident configuration.
      readings.sort((a, b) -> a.meanWordConf() != b.meanWordConf() ? Double.compare(b.meanWordConf(), a.meanWordConf()) : a.system().compareTo(b.system()));
      for (int r = 0; r < readings.size(); r++) {
        OcrSimulator.Reading h = readings.get(r);
        double mwc = Double.parseDouble(CsvText.fixed(h.meanWordConf(), 2));
        nbest.append(CsvText.row(id, "1", h.system(), h.text(), CsvText.fixed(StrictMath.log(mwc / 100.0), 6), CsvText.fixed(mwc, 2), group));
      }
      refCsv.append(CsvText.row(id, ref, group));
    }
    files.put("dockets-" + set + ".nbest.csv", nbest.toString());
    files.put("dockets-" + set + ".refs.csv", refCsv.toString());
  }

  private static String manifest(long seed, Sizes sizes, SortedMap<String, String> files) {
    StringBuilder sb = new StringBuilder();
    sb.append("Tallowmere Produce Cooperative demo data (invented scenario; generated, do not edit by hand)\n");
    sb.append("regenerate: ./steelyard demo-data --out sample-hypotheses --seed ").append(seed).append('\n');
    sb.append("seed: ").append(seed).append('\n');
    sb.append(String.format(Locale.ROOT, "sizes: voice %d utterances per set, docket %d lines per set, corpora %d + %d lines\n",
        sizes.voiceUtterances(), sizes.docketLines(), sizes.voiceCorpus(), sizes.docketCorpus()));
    for (Map.Entry<String, String> e : files.entrySet()) {
      long lines = e.getValue().chars().filter(c -> c == '\n').count();
      sb.append(String.format(Locale.ROOT, "%s: %d lines, %d bytes", e.getKey(), lines, e.getValue().getBytes(StandardCharsets.UTF_8).length)).append('\n');
    }
    return sb.toString();
  }
}
