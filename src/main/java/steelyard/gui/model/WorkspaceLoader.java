package steelyard.gui.model;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import steelyard.eval.Aligner;
import steelyard.io.ImportOptions;
import steelyard.io.InputException;
import steelyard.io.InputFiles;
import steelyard.io.Reference;
import steelyard.lm.LanguageModel;
import steelyard.lm.LoadProgress;
import steelyard.lm.ModelFiles;
import steelyard.lm.train.CorpusFile;
import steelyard.lm.train.Smoothing;
import steelyard.lm.train.Trainer;
import steelyard.lm.train.TrainingOptions;
import steelyard.rescore.ReferenceScorer;
import steelyard.rescore.RescoreConfig;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.ScoredSet;
import steelyard.rescore.ScoredUtterance;
import steelyard.text.Normaliser;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

/**
 * Opens an {@link OpenRequest} through the rescoring service: a {@link RescoreSession} (weights file, model,
 * unit, tokenisers, as {@code steelyard rescore} resolves them) reads the whole hypotheses file and its
 * references into a {@link ScoredSet}; each hypothesis is then aligned once against its reference
 * ({@link ReferenceScorer#hypothesisErrors}). A model may instead be trained from a text file first. Progress:
 * the model takes the first 40 % when there is one, the hypotheses the rest (by rows, counted up front for a
 * plain file; unknown for a gzipped one). The references are read a second time for their raw texts (the
 * scored set keeps their tokens), which the list searches and the detail shows.
 */
final class WorkspaceLoader {
  private static final double MODEL_SHARE = 0.4;

  private WorkspaceLoader() {}

  static Workspace load(OpenRequest req, TaskProgress progress) {
    List<String> warnings = Collections.synchronizedList(new ArrayList<>());
    LanguageModel trained = req.lmText() == null ? null : train(req, progress);
    RescoreConfig config = RescoreConfig.builder()
        .features(req.features())
        .weightsFile(req.weights())
        .overrides(req.overrides())
        .modelPath(req.lm())
        .model(trained)
        .modelLoading(new ModelFiles.LoadOptions(req.oovLog10Prob(), null, modelProgress(req, progress)))
        .normalisation(req.normalisation())
        .unit(req.unit())
        .method(req.methodOrDefault())
        .importOptions(new ImportOptions(List.of(), req.primarySystem(), req.maxBadRows(), warnings::add,
            s -> warnings.add("skipped " + s.file() + ":" + s.line() + ": " + s.reason())))
        .build();
    if (req.lm() != null) progress.report(0, "reading the model " + req.lm().getFileName());
    RescoreSession session = RescoreSession.open(config);
    double from = req.lm() != null || req.lmText() != null ? MODEL_SHARE : 0;
    long expected = dataLines(req.hyps());
    String note = "reading " + req.hyps().getFileName();
    progress.report(expected > 0 ? from : Double.NaN, note);
    ScoredSet set = session.loadAll(req.hyps(), req.refs(), Runtime.getRuntime().availableProcessors(), (utts, hyps) -> {
      if ((utts & 63) == 0) progress.report(expected > 0 ? from + (1 - from) * Math.min(1, (double) hyps / expected) : Double.NaN,
          note + ": " + utts + " utterances");
    }, progress::isCancelled);
    Map<String, Reference> refs = req.refs() == null ? Map.of() : session.readReferences(req.refs());
    List<String> all = new ArrayList<>(session.warnings());
    all.addAll(warnings);
    return new Workspace(req, session, set, corpus(set, refs), all);
  }

  private static LoadProgress modelProgress(OpenRequest req, TaskProgress progress) {
    return new LoadProgress() {
      private long total = 1;
      @Override public void start(long t) { total = Math.max(1, t); }
      @Override public void step(long done) {
        progress.checkCancelled();
        progress.report(MODEL_SHARE * Math.min(1, (double) done / total), "reading the model " + req.lm().getFileName());
      }
      @Override public void end() {}
    };
  }

  /** A modified Kneser-Ney model of {@code req.lmText()} at the request's unit (words when automatic). */
  private static LanguageModel train(OpenRequest req, TaskProgress progress) {
    Unit unit = req.unit() == null ? Unit.WORD : req.unit();
    if (!Files.isRegularFile(req.lmText())) throw InputException.inFile(req.lmText(), "no such file", "a readable corpus file");
    TrainingOptions t = new TrainingOptions(req.trainOrder(), unit, req.normalisation(), Smoothing.MKN, 0, 0, new int[0], 1.0);
    progress.report(Double.NaN, "training a " + req.trainOrder() + "-gram model on " + req.lmText().getFileName());
    return new Trainer(t).onSentences(n -> progress.checkCancelled())
        .train(new CorpusFile(req.lmText(), Normaliser.create(req.normalisation()), unit)).model();
  }

  private static Corpus corpus(ScoredSet set, Map<String, Reference> refs) {
    int n = set.size();
    ScoredUtterance[] scored = new ScoredUtterance[n];
    String[] groups = new String[n];
    Reference[] references = new Reference[n];
    TokenSequence[] refTokens = new TokenSequence[n];
    int[] refLength = new int[n];
    int[] start = new int[n + 1];
    for (int u = 0; u < n; u++) start[u + 1] = start[u] + set.utterances().get(u).scores().size();
    int[] errors = new int[start[n]];
    boolean[] same = new boolean[start[n]];
    ThreadLocal<Aligner> aligners = ThreadLocal.withInitial(Aligner::new);
    java.util.stream.IntStream.range(0, n).parallel().forEach(u -> {
      ScoredSet.Entry e = set.utterances().get(u);
      if (e.reference() != null) {
        System.arraycopy(ReferenceScorer.hypothesisErrors(e.scores(), e.reference(), aligners.get()), 0, errors, start[u], e.scores().size());
      }
    });
    for (int u = 0; u < n; u++) {
      ScoredSet.Entry e = set.utterances().get(u);
      ScoredUtterance s = e.scores();
      scored[u] = s;
      groups[u] = e.group();
      refTokens[u] = e.reference();
      references[u] = e.reference() == null ? null : refs.get(e.uttId());
      List<String> first = s.tokens(s.firstIndex()).tokens();
      for (int i = 0; i < s.size(); i++) same[start[u] + i] = s.tokens(i).tokens().equals(first);
      if (e.reference() == null) {
        java.util.Arrays.fill(errors, start[u], start[u + 1], Corpus.NO_REFERENCE);
        continue;
      }
      refLength[u] = (int) ReferenceScorer.allDeleted(e.reference()).deletions();
    }
    List<Reference> orphans = new ArrayList<>();
    long orphanTokens = 0;
    for (ScoredSet.Missing m : set.missingHypotheses()) {
      Reference r = refs.get(m.uttId());
      orphans.add(r != null ? r : new Reference(m.uttId(), Normaliser.join(m.reference().tokens(), set.unit()), m.group(), 0));
      orphanTokens += m.errors().deletions();
    }
    return new Corpus(set.featureNames(), set.unit(), scored, groups, references, refTokens, refLength, start, errors, same, orphans,
        orphanTokens);
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
}
