package org.tufa.mapper.model;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;
import java.util.SortedSet;

/**
 * Finds a cycle in a directed graph given as sorted adjacency sets, by depth-first search with three colours
 * (Cormen, Leiserson, Rivest and Stein, Introduction to Algorithms, 3rd ed., section 22.3: a back edge means a
 * cycle). Nodes are visited in sorted order, so the cycle reported is always the same one.
 */
final class LinkCycles {

    private LinkCycles() {
    }

    /** The first cycle found, as its nodes from start back to the start (start repeated last); empty if none. */
    static List<String> first(SortedMap<String, SortedSet<String>> edges) {
        Map<String, Integer> colour = new HashMap<>();
        for (String start : edges.keySet()) {
            if (colour.getOrDefault(start, 0) == 0) {
                List<String> path = new ArrayList<>();
                List<String> cycle = visit(start, edges, colour, path);
                if (!cycle.isEmpty()) {
                    return cycle;
                }
            }
        }
        return List.of();
    }

    // Iterative rather than recursive: a long chain of parts must not overflow the stack.
    private static List<String> visit(String start, SortedMap<String, SortedSet<String>> edges,
            Map<String, Integer> colour, List<String> path) {
        List<java.util.Iterator<String>> stack = new ArrayList<>();
        colour.put(start, 1);
        path.add(start);
        stack.add(edges.getOrDefault(start, java.util.Collections.emptySortedSet()).iterator());
        while (!stack.isEmpty()) {
            java.util.Iterator<String> next = stack.get(stack.size() - 1);
            if (!next.hasNext()) {
                colour.put(path.remove(path.size() - 1), 2);
                stack.remove(stack.size() - 1);
                continue;
            }
            String to = next.next();
            int c = colour.getOrDefault(to, 0);
            if (c == 1) {
                List<String> cycle = new ArrayList<>(path.subList(path.indexOf(to), path.size()));
                cycle.add(to);
                return cycle;
            }
            if (c == 0) {
                colour.put(to, 1);
                path.add(to);
                stack.add(edges.getOrDefault(to, java.util.Collections.emptySortedSet()).iterator());
            }
        }
        return List.of();
    }
}
