package dev.quern;

import java.util.Collection;
import java.util.Locale;
import java.util.Optional;

/** "Did you mean" hints: the closest known name within a small edit distance. */
public final class Suggestions {

    private Suggestions() {
    }

    public static Optional<String> closest(String typed, Collection<String> known) {
        String best = null;
        int bestDistance = Integer.MAX_VALUE;
        String lowered = typed.toLowerCase(Locale.ROOT);
        for (String candidate : known) {
            int d = distance(lowered, candidate.toLowerCase(Locale.ROOT));
            if (d < bestDistance) {
                best = candidate;
                bestDistance = d;
            }
        }
        int allowed = Math.max(1, Math.min(3, typed.length() / 3));
        return bestDistance <= allowed ? Optional.ofNullable(best) : Optional.empty();
    }

    /** " (did you mean x?)" or nothing. */
    public static String hint(String typed, Collection<String> known) {
        return closest(typed, known).map(s -> " (did you mean " + s + "?)").orElse("");
    }

    /** Optimal string alignment distance: a swap of two neighbouring letters counts as one edit. */
    static int distance(String a, String b) {
        int[][] d = new int[a.length() + 1][b.length() + 1];
        for (int i = 0; i <= a.length(); i++) {
            d[i][0] = i;
        }
        for (int j = 0; j <= b.length(); j++) {
            d[0][j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            for (int j = 1; j <= b.length(); j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                d[i][j] = Math.min(Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1), d[i - 1][j - 1] + cost);
                if (i > 1 && j > 1 && a.charAt(i - 1) == b.charAt(j - 2) && a.charAt(i - 2) == b.charAt(j - 1)) {
                    d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
                }
            }
        }
        return d[a.length()][b.length()];
    }
}
