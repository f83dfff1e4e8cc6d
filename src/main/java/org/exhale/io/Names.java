package org.exhale.io;

import java.util.Collection;

/** Did-you-mean help for misspelt keys, names and units. */
public final class Names {
    private Names() {
    }

    /** The candidate closest to {@code word} by edit distance (case-insensitive), or null if none is close. */
    public static String closest(String word, Collection<String> candidates) {
        String best = null;
        int bestDistance = Integer.MAX_VALUE;
        String w = word.toLowerCase(java.util.Locale.ROOT);
        for (String c : candidates) {
            int d = distance(w, c.toLowerCase(java.util.Locale.ROOT));
            if (d < bestDistance) {
                bestDistance = d;
                best = c;
            }
        }
        int allowed = Math.max(1, Math.min(3, word.length() / 3));
        return bestDistance <= allowed ? best : null;
    }

    /** Levenshtein distance. */
    static int distance(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                cur[j] = Math.min(Math.min(cur[j - 1] + 1, prev[j] + 1), prev[j - 1] + cost);
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }
}
