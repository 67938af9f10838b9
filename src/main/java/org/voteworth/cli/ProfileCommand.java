package org.voteworth.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.voteworth.analysis.ReviewerProfile;
import org.voteworth.report.OutputFormat;
import org.voteworth.report.ProfileWriter;
import org.voteworth.store.Store;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code voteworth profile ID... --store DIR}: reviewers looked up in a store, across all categories. */
@Command(name = "profile", mixinStandardHelpOptions = true,
        description = {"Profiles reviewers across all categories from a store written by 'tally --store': reviews by "
                + "category, stars against each category's, helpful share per review, verified and incentivised shares, "
                + "activity per month, the busiest days, first and last review.",
                "Reads only the part file and row groups that can hold each reviewer."})
final class ProfileCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(arity = "1..*", paramLabel = "ID", description = "Reviewer ids, as in the dump.")
    List<String> ids = new ArrayList<>();

    @Option(names = "--store", required = true, paramLabel = "DIR", description = "The store folder (written by 'tally --store DIR').")
    Path store;

    @Mixin
    PrivacyOptions privacy;

    @Mixin
    ReportOptions report;

    @Override
    public Integer call() throws IOException {
        OutputFormat f = report.format();
        Store s = Store.open(store);
        List<ReviewerProfile> profiles = new ArrayList<>();
        int missing = 0;
        for (String id : ids) {
            ReviewerProfile p = ReviewerProfile.of(s, id);
            missing += p.found() ? 0 : 1;
            profiles.add(p);
        }
        Map<String, String> parameters = ProfileWriter.storeParameters(store.toString(), s.manifest());
        report.prepare(new DumpOptions());
        report.emit(spec, "profile", f, ProfileWriter.write(profiles, f, privacy.ids(), parameters));
        if (missing > 0 && !report.quiet) {
            spec.commandLine().getErr().println("profile: " + missing + " of " + ids.size() + " ids are not in the store");
            spec.commandLine().getErr().flush();
        }
        return 0;
    }
}
