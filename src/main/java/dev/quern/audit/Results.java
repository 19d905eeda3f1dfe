package dev.quern.audit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** What the checks hand the audit: each check's result and the findings it made. */
final class Results {

    final List<CheckResult> checks = new ArrayList<>();
    final List<Finding> findings = new ArrayList<>();

    void pass(Check check, String evidence) {
        checks.add(new CheckResult(check, true, evidence));
    }

    void notApplicable(Check check, String evidence) {
        checks.add(new CheckResult(check, false, evidence));
    }

    void find(Finding finding) {
        findings.add(finding);
    }

    /** 12,345: counts read better with grouping. */
    static String count(long n) {
        return String.format(Locale.ROOT, "%,d", n);
    }

    /** A statistic to three decimals. */
    static String decimal(double v) {
        return String.format(Locale.ROOT, "%.3f", v);
    }

    /** "a, b and c". */
    static String list(List<String> items) {
        if (items.isEmpty()) {
            return "";
        }
        if (items.size() == 1) {
            return items.get(0);
        }
        return String.join(", ", items.subList(0, items.size() - 1)) + " and " + items.get(items.size() - 1);
    }

    /** A short form of a long list of columns: the first few, then how many more. */
    static String columns(List<String> columns) {
        if (columns.size() <= 4) {
            return list(columns);
        }
        return String.join(", ", columns.subList(0, 3)) + " and " + (columns.size() - 3) + " more";
    }

    static String plural(long n, String one, String many) {
        return count(n) + " " + (n == 1 ? one : many);
    }
}
