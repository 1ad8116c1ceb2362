package dev.nanoplan.desktop;

import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.plan.SharedRates;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The shown plan as table models: links, routes, budgets, warnings, the comparison with a kept
 * baseline design, and the selected link and route (kept across plans by their endpoints).
 * A preview replaces links, routes and warnings but keeps the budgets of the last exact plan
 * (a preview has none). Threading: the UI thread only.
 */
public final class PlanTables {

    private final ReadOnlyObjectWrapper<Plan> plan = new ReadOnlyObjectWrapper<>();
    private final ReadOnlyObjectWrapper<Plan> baseline = new ReadOnlyObjectWrapper<>();
    private final ReadOnlyBooleanWrapper previewShown = new ReadOnlyBooleanWrapper(false);
    private final ObjectProperty<LinkReport> selectedLink = new SimpleObjectProperty<>();
    private final ObjectProperty<RouteReport> selectedRoute = new SimpleObjectProperty<>();
    private final BooleanProperty showRoutesOnly = new SimpleBooleanProperty(false);
    private final ObservableList<LinkReport> links = FXCollections.observableArrayList();
    private final ObservableList<RouteReport> routes = FXCollections.observableArrayList();
    private final ObservableList<BudgetReport> budgets = FXCollections.observableArrayList();
    private final ObservableList<String> warnings = FXCollections.observableArrayList();
    private final ObservableList<DemandComparison> comparison = FXCollections.observableArrayList();
    private Plan sharesPlan;
    private Map<RouteReport, SharedRates.Share> shares = Map.of();

    /** Shows a plan; the selected link and route move to those of {@code p} with the same endpoints. */
    void apply(Plan p, boolean preview) {
        LinkReport oldLink = selectedLink.get();
        RouteReport oldRoute = selectedRoute.get();
        previewShown.set(preview);
        plan.set(p);
        links.setAll(p.links());
        routes.setAll(p.routes());
        if (!preview) {
            budgets.setAll(p.budgets());
        }
        warnings.setAll(p.warnings());
        selectedLink.set(oldLink == null ? null : findLink(oldLink.from(), oldLink.to()));
        selectedRoute.set(oldRoute == null ? null
                : p.routes().stream().filter(r -> r.from().equals(oldRoute.from()) && r.to().equals(oldRoute.to()))
                        .findFirst().orElse(null));
        refreshComparison();
    }

    /** Keeps {@code p} (null clears) as the design later plans are compared with. */
    void keep(Plan p) {
        baseline.set(p);
        refreshComparison();
    }

    /** Forgets the selected link and route. */
    void clearSelection() {
        selectedLink.set(null);
        selectedRoute.set(null);
    }

    /** Selects the link from → to of the current plan (null clears). */
    public void selectLink(String from, String to) {
        selectedLink.set(from == null ? null : findLink(from, to));
    }

    /** The link from → to of the current plan, or null. */
    public LinkReport findLink(String from, String to) {
        return links.stream().filter(l -> l.from().equals(from) && l.to().equals(to)).findFirst().orElse(null);
    }

    /**
     * The rate of this route of the current plan when the demands sharing an emitter time-share its
     * stream ({@link SharedRates}), or null when the route is not in the plan. Computed once per plan.
     */
    public SharedRates.Share sharedRate(RouteReport route) {
        Plan p = plan.get();
        if (p == null) {
            return null;
        }
        if (p != sharesPlan) {
            Map<RouteReport, SharedRates.Share> m = new IdentityHashMap<>();
            List<SharedRates.Share> all = SharedRates.of(p);
            for (int i = 0; i < all.size(); i++) {
                m.put(p.routes().get(i), all.get(i));
            }
            shares = m;
            sharesPlan = p;
        }
        return shares.get(route);
    }

    private void refreshComparison() {
        comparison.setAll(DemandComparison.of(baseline.get(), plan.get()));
    }

    public ReadOnlyObjectProperty<Plan> planProperty() {
        return plan.getReadOnlyProperty();
    }

    public ReadOnlyObjectProperty<Plan> baselineProperty() {
        return baseline.getReadOnlyProperty();
    }

    public ReadOnlyBooleanProperty previewShownProperty() {
        return previewShown.getReadOnlyProperty();
    }

    public ObjectProperty<LinkReport> selectedLinkProperty() {
        return selectedLink;
    }

    public ObjectProperty<RouteReport> selectedRouteProperty() {
        return selectedRoute;
    }

    public BooleanProperty showRoutesOnlyProperty() {
        return showRoutesOnly;
    }

    public ObservableList<LinkReport> links() {
        return links;
    }

    public ObservableList<RouteReport> routes() {
        return routes;
    }

    public ObservableList<BudgetReport> budgets() {
        return budgets;
    }

    public ObservableList<String> warnings() {
        return warnings;
    }

    public ObservableList<DemandComparison> comparison() {
        return comparison;
    }
}
