package steelyard.gui.model;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import steelyard.io.FeatureSpec;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.text.NormalisationOptions;

/**
 * A three-utterance input small enough to work out by hand, with a unigram model whose log10 values are
 * exact binary fractions. Under acoustic weight 1, μ = 0:
 * <ul>
 *   <li>{@code a}: "ten crates" (rank 1, −10) against "ten crate" (−11); the model also prefers rank 1, so
 *       rank 1 wins at every λ ≥ 0; reference "ten crates": 0 and 1 errors.
 *   <li>{@code b}: "bay nine" (rank 1, −8) against "day nine" (−7.5); the model prefers "bay" by one log10
 *       unit, so total(b1) − total(b2) = −0.5 + λ·ln 10: rank 2 wins below λ = 0.5 / ln 10 ≈ 0.2171, rank 1
 *       above; reference "day nine": 1 and 0 errors.
 *   <li>{@code c}: "load pears" alone; reference "load the pears": one deletion.
 * </ul>
 * N = 7, so at λ = 0 the choice has 1 error (1/7), rank 1 has 2 (2/7), the oracle 1 (1/7).
 */
final class TinyCorpus {
  /** λ where utterance b flips back to rank 1: 0.5 / ln 10. */
  static final double FLIP = 0.5 / Math.log(10);

  private TinyCorpus() {}

  static Workspace open(Path dir) throws IOException {
    Path hyps = dir.resolve("tiny.nbest.csv");
    Path refs = dir.resolve("tiny.refs.csv");
    Path lm = dir.resolve("tiny.arpa");
    Files.writeString(hyps, "utt_id,rank,text,acoustic,group\n"
        + "a,1,ten crates,-10,spk1\na,2,ten crate,-11,spk1\n"
        + "b,1,bay nine,-8,spk2\nb,2,day nine,-7.5,spk2\n"
        + "c,1,load pears,-5,spk1\n");
    Files.writeString(refs, "utt_id,text\na,ten crates\nb,day nine\nc,load the pears\n");
    Files.writeString(lm, "\\data\\\nngram 1=11\n\n\\1-grams:\n"
        + "-99\t<s>\t0\n-1\t</s>\n-3\t<unk>\n-1\tten\n-1\tcrates\n-3\tcrate\n-1\tbay\n-2\tday\n-1\tnine\n-1\tload\n-1.5\tpears\n"
        + "\n\\end\\\n");
    return Workspace.open(OpenRequest.of(hyps, refs, lm, null, FeatureSpec.parseList("acoustic"), null, NormalisationOptions.EXACT,
        RescoreMethod.NBEST), TaskProgress.NONE);
  }

  static RescoreWeights at(Workspace w, double lambda, double mu) {
    return new WeightSettings(lambda, mu, 1, 0, 0, RescoreMethod.NBEST).apply(w.initialWeights());
  }
}
