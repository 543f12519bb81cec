package steelyard.lattice;

import java.util.List;

/**
 * The lattice oracle of one utterance: a path through the confusion network with the fewest errors against
 * the reference.
 *
 * @param tokens the path's tokens (empty arcs removed)
 * @param errors substitutions + deletions + insertions of {@code tokens} against the reference (unit costs)
 */
public record OraclePath(List<String> tokens, int errors) {
  public OraclePath {
    tokens = List.copyOf(tokens);
  }
}
