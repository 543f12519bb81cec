package steelyard.tune;

import java.util.ArrayList;
import java.util.List;
import java.util.TreeSet;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.ScoredUtterance;
import steelyard.text.TokenSequence;

/**
 * What the network methods' tuning shares: the input, the N-best candidate table (hypothesis errors, rank-1
 * errors, reference sizes) and each utterance's scoring-unit token lists as the networks take them (made once:
 * one list of references to the existing token lists per utterance).
 */
final class NetworkData {
  final TuneInput input;
  final CandidateTable nbest;
  private final List<List<List<String>>> tokens;
  private final int[] all;

  NetworkData(TuneInput input, CandidateTable nbest) {
    this.input = input;
    this.nbest = nbest;
    this.tokens = new ArrayList<>(input.size());
    for (DevUtterance d : input.utterances()) tokens.add(NbestRescorer.tokenLists(d.scores()));
    this.all = nbest.all();
  }

  int size() {
    return input.size();
  }

  int[] all() {
    return all;
  }

  ScoredUtterance scores(int u) {
    return input.utterances().get(u).scores();
  }

  TokenSequence reference(int u) {
    return input.utterances().get(u).reference();
  }

  List<List<String>> tokens(int u) {
    return tokens.get(u);
  }

  /** Distinct system names over all utterances, sorted. */
  List<String> systems() {
    return systems(input);
  }

  static List<String> systems(TuneInput input) {
    TreeSet<String> names = new TreeSet<>();
    for (DevUtterance d : input.utterances()) names.addAll(d.scores().systems());
    return new ArrayList<>(names);
  }

  /** Pool-table columns that move: 1 (λ′) when a model is loaded and it is tuned, 2 (μ′) when tuned. */
  int[] latticeDims(TuneSettings s) {
    boolean lm = input.model() != null && s.moves(WeightNames.LATTICE_LM, true);
    boolean len = s.moves(WeightNames.LATTICE_LENGTH, true);
    return lm && len ? new int[] {1, 2} : lm ? new int[] {1} : len ? new int[] {2} : new int[0];
  }
}
