package steelyard.gui.model;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.CancellationException;
import steelyard.eval.Aligner;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.InputException;
import steelyard.io.InputFiles;
import steelyard.io.Reference;
import steelyard.io.ReferencesReader;
import steelyard.io.UtteranceHypotheses;
import steelyard.lm.LanguageModel;
import steelyard.lm.LoadProgress;
import steelyard.lm.ModelFiles;
import steelyard.lm.train.CorpusFile;
import steelyard.lm.train.Smoothing;
import steelyard.lm.train.Trainer;
import steelyard.lm.train.TrainingOptions;
import steelyard.rescore.HypothesisScorer;
import steelyard.rescore.OrderedBatches;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.Tokenizer;
import steelyard.rescore.WeightsFile;
import steelyard.rescore.WeightsSpec;
import steelyard.text.Normaliser;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

/**
 * Opens an {@link OpenRequest} the way {@code steelyard rescore} does: weights file first (it may name the
 * features and the unit), then the model (loaded, or trained from a text file), the references and the
 * hypotheses, scored in ordered batches on all cores; each hypothesis is aligned once against its reference.
 * Progress: the model takes the first 40 % when there is one, the hypotheses the rest (by rows, counted
 * up front for a plain file; unknown for a gzipped one).
 */
final class WorkspaceLoader {
  private static final double MODEL_SHARE = 0.4;

  private WorkspaceLoader() {}

  /** One scored utterance with what the corpus keeps of its reference. */
  private record Loaded(ScoredUtterance scored, Reference reference, TokenSequence refTokens, int refLength, int[] errors,
      boolean[] sameAsFirst) {}

  static Workspace load(OpenRequest req, TaskProgress progress) {
    List<String> warnings = Collections.synchronizedList(new ArrayList<>());
    List<FeatureSpec> specs = new ArrayList<>(req.features());
    List<String> names = new ArrayList<>();
    for (FeatureSpec s : specs) names.add(s.name());
    WeightsSpec fileSpec = req.weights() == null ? new WeightsSpec() : WeightsFile.read(req.weights(), names);
    if (specs.isEmpty()) {
      for (String n : fileSpec.features.keySet()) specs.add(FeatureSpec.parse(n));
      names.addAll(fileSpec.features.keySet());
    }
    RescoreWeights weights = fileSpec.resolve(names);
    LanguageModel model = model(req, progress, warnings);
    Unit unit = req.unit() != null ? req.unit() : fileSpec.unit != null ? fileSpec.unit : model != null ? model.unit() : Unit.WORD;
    if (model != null && model.unit() != unit)
      warnings.add("the model's unit is " + label(model.unit()) + ", the scoring unit " + label(unit));
    Normaliser scoring = Normaliser.create(req.normalisation());
    Tokenizer unitTokens = raw -> scoring.tokens(raw, unit);
    Tokenizer lmTokens = unitTokens;
    if (model != null && (model.unit() != unit || !model.normalisation().equals(req.normalisation()))) {
      Normaliser lmNorm = Normaliser.create(model.normalisation());
      Unit lmUnit = model.unit();
      lmTokens = raw -> lmNorm.tokens(raw, lmUnit);
    }
    ImportOptions options = new ImportOptions(specs, null, req.maxBadRows(), warnings::add,
        s -> warnings.add("skipped " + s.file() + ":" + s.line() + ": " + s.reason()));
    Map<String, Reference> refs = req.refs() == null ? Map.of() : ReferencesReader.readAll(req.refs(), options);
    HypothesisScorer scorer = new HypothesisScorer(model, lmTokens, unitTokens, names.size(), 0);
    Corpus corpus = read(req, options, scorer, unitTokens, refs, unit, names, progress);
    return new Workspace(req, corpus, model, scorer, weights, warnings);
  }

  private static LanguageModel model(OpenRequest req, TaskProgress progress, List<String> warnings) {
    if (req.lm() != null) {
      progress.report(0, "reading the model " + req.lm().getFileName());
      LoadProgress p = new LoadProgress() {
        private long total = 1;
        @Override public void start(long t) { total = Math.max(1, t); }
        @Override public void step(long done) {
          progress.checkCancelled();
          progress.report(MODEL_SHARE * Math.min(1, (double) done / total), "reading the model " + req.lm().getFileName());
        }
        @Override public void end() {}
      };
      return ModelFiles.load(req.lm(), new ModelFiles.LoadOptions(ModelFiles.LoadOptions.DEFAULT.unknownFloorLog10(), warnings::add, p));
    }
    if (req.lmText() == null) return null;
    Unit unit = req.unit() == null ? Unit.WORD : req.unit();
    TrainingOptions t = new TrainingOptions(req.trainOrder(), unit, req.normalisation(), Smoothing.MKN, 0, 0, new int[0], 1.0);
    if (!Files.isRegularFile(req.lmText())) throw InputException.inFile(req.lmText(), "no such file", "a readable corpus file");
    progress.report(Double.NaN, "training a " + req.trainOrder() + "-gram model on " + req.lmText().getFileName());
    return new Trainer(t).onSentences(n -> progress.checkCancelled())
        .train(new CorpusFile(req.lmText(), Normaliser.create(req.normalisation()), unit)).model();
  }

  private static Corpus read(OpenRequest req, ImportOptions options, HypothesisScorer scorer, Tokenizer unitTokens,
      Map<String, Reference> refs, Unit unit, List<String> names, TaskProgress progress) {
    double from = req.lm() != null || req.lmText() != null ? MODEL_SHARE : 0;
    long expectedRows = dataLines(req.hyps());
    String note = "reading " + req.hyps().getFileName();
    progress.report(expectedRows > 0 ? from : Double.NaN, note);
    List<Loaded> loaded = new ArrayList<>();
    Set<String> seen = new HashSet<>();
    ThreadLocal<Aligner> aligners = ThreadLocal.withInitial(Aligner::new);
    try (HypothesesReader reader = HypothesesReader.open(req.hyps(), options)) {
      OrderedBatches.run(reader, u -> score(u, scorer, unitTokens, refs.get(u.uttId()), aligners.get()),
          Runtime.getRuntime().availableProcessors(), OrderedBatches.DEFAULT_BATCH, l -> {
            progress.checkCancelled();
            loaded.add(l);
            seen.add(l.scored().uttId());
            if ((loaded.size() & 63) == 0) {
              double f = expectedRows > 0 ? from + (1 - from) * Math.min(1, (double) reader.rowsRead() / expectedRows) : Double.NaN;
              progress.report(f, note + ": " + loaded.size() + " utterances");
            }
          });
    } catch (InputException | CancellationException e) {
      throw e;
    } catch (RuntimeException e) {
      throw e;
    } catch (Exception e) {
      throw new IllegalStateException(e);
    }
    return corpus(loaded, refs, seen, unitTokens, unit, names);
  }

  private static Loaded score(UtteranceHypotheses u, HypothesisScorer scorer, Tokenizer unitTokens, Reference ref, Aligner aligner) {
    ScoredUtterance s = scorer.score(u);
    int n = s.size();
    int[] errors = new int[n];
    boolean[] same = new boolean[n];
    List<String> first = s.tokens(s.firstIndex()).tokens();
    for (int i = 0; i < n; i++) same[i] = s.tokens(i).tokens().equals(first);
    if (ref == null) {
      java.util.Arrays.fill(errors, Corpus.NO_REFERENCE);
      return new Loaded(s, null, null, 0, errors, same);
    }
    TokenSequence refTokens = unitTokens.tokenize(ref.text());
    Object2IntOpenHashMap<String> ids = new Object2IntOpenHashMap<>();
    int[] refIds = Workspace.ids(refTokens.tokens(), ids);
    for (int i = 0; i < n; i++) {
      TokenSequence h = s.tokens(i);
      errors[i] = (int) aligner.count(refIds, refTokens.optional(), Workspace.ids(h.tokens(), ids), h.optional()).errors();
    }
    return new Loaded(s, ref, refTokens, required(refTokens), errors, same);
  }

  private static Corpus corpus(List<Loaded> loaded, Map<String, Reference> refs, Set<String> seen, Tokenizer unitTokens,
      Unit unit, List<String> names) {
    int n = loaded.size();
    ScoredUtterance[] scored = new ScoredUtterance[n];
    String[] groups = new String[n];
    Reference[] references = new Reference[n];
    TokenSequence[] refTokens = new TokenSequence[n];
    int[] refLength = new int[n];
    int[] start = new int[n + 1];
    IntArrayList errors = new IntArrayList();
    boolean[] same = new boolean[loaded.stream().mapToInt(l -> l.errors().length).sum()];
    for (int u = 0; u < n; u++) {
      Loaded l = loaded.get(u);
      scored[u] = l.scored();
      references[u] = l.reference();
      refTokens[u] = l.refTokens();
      refLength[u] = l.refLength();
      String g = l.scored().utterance().first().group();
      groups[u] = !g.isEmpty() || l.reference() == null ? g : l.reference().group();
      start[u + 1] = start[u] + l.errors().length;
      errors.addElements(errors.size(), l.errors());
      System.arraycopy(l.sameAsFirst(), 0, same, start[u], l.errors().length);
    }
    List<Reference> orphans = new ArrayList<>();
    long orphanTokens = 0;
    for (Reference r : refs.values()) {
      if (seen.contains(r.uttId())) continue;
      orphans.add(r);
      orphanTokens += required(unitTokens.tokenize(r.text()));
    }
    return new Corpus(names, unit, scored, groups, references, refTokens, refLength, start, errors.toIntArray(), same, orphans,
        orphanTokens);
  }

  /** Tokens that count in N: the non-optional ones. */
  private static int required(TokenSequence t) {
    int k = 0;
    for (boolean o : t.optional()) if (!o) k++;
    return k;
  }

  /** Data rows of a plain file (newlines after the header), or −1 for a gzipped or unreadable one. */
  private static long dataLines(Path file) {
    if (InputFiles.isGzipName(file)) return -1;
    try (InputStream in = Files.newInputStream(file)) {
      byte[] buf = new byte[1 << 16];
      long lines = 0;
      for (int k; (k = in.read(buf)) > 0; ) for (int i = 0; i < k; i++) if (buf[i] == '\n') lines++;
      return Math.max(1, lines - 1);
    } catch (IOException e) {
      return -1;
    }
  }

  private static String label(Unit u) {
    return u == Unit.WORD ? "word" : "char";
  }
}
