package dev.nanoplan.desktop;

import static dev.nanoplan.desktop.Widgets.cell;
import static dev.nanoplan.desktop.Widgets.fitColumns;
import static dev.nanoplan.desktop.Widgets.number;
import static dev.nanoplan.desktop.Widgets.numberText;
import static dev.nanoplan.desktop.Widgets.text;

import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.report.Numbers;
import java.util.List;
import javafx.collections.ListChangeListener;
import javafx.css.PseudoClass;
import javafx.scene.control.Label;
import javafx.scene.control.TableView;
import javafx.scene.control.TextArea;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;

/**
 * The plan's tables (a View): links, routes with the selected route's summary, budgets, and the
 * comparison with a kept design, bound to {@link PlanTables}. The link table's selection and the
 * view model's selected link follow each other; while a preview is shown the tables carry the
 * {@code :preview} pseudo-class.
 */
final class PlanTablesView {

    private final PlannerViewModel vm;
    private final Runnable showLinks;
    private final TableView<LinkReport> linkTable = new TableView<>();
    private final TableView<RouteReport> routeTable = new TableView<>();
    private final TableView<BudgetReport> budgetTable = new TableView<>();
    private boolean syncing;

    /** @param showLinks brings the link table to the front (when a link is selected elsewhere) */
    PlanTablesView(PlannerViewModel vm, Runnable showLinks) {
        this.vm = vm;
        this.showLinks = showLinks;
        build();
        PseudoClass previewing = PseudoClass.getPseudoClass("preview");
        vm.tables().previewShownProperty().addListener((o, a, b) -> {
            linkTable.pseudoClassStateChanged(previewing, b);
            routeTable.pseudoClassStateChanged(previewing, b);
            budgetTable.pseudoClassStateChanged(previewing, b);
        });
    }

    TableView<LinkReport> linkTable() {
        return linkTable;
    }

    TableView<RouteReport> routeTable() {
        return routeTable;
    }

    TableView<BudgetReport> budgetTable() {
        return budgetTable;
    }

    private void build() {
        linkTable.getColumns().addAll(List.of(
                text("from", LinkReport::from),
                text("to", LinkReport::to),
                text("species", LinkReport::species),
                number("info bit", LinkReport::mutualInformationBits),
                cell("capacity bit", l -> l.capacityBits() == null ? Double.NaN : l.capacityBits(),
                        l -> TableText.number(l.capacityBits(), "not applicable: capacity not computed for this plan")),
                number("rate bit/s", LinkReport::rateBitsPerS),
                numberText("error", l -> l.errorProbability() > 0 ? l.errorProbability() : Math.pow(10, l.log10ErrorProbability()),
                        l -> Formats.error(l.errorProbability(), l.log10ErrorProbability())),
                numberText("τ", l -> (double) l.threshold(), l -> Numbers.threshold(l.threshold())),
                text("limited by", l -> TableText.impairment(l.limitedBy())),
                text("top interferer", l -> l.topInterferer() == null ? "" : l.topInterferer())));
        linkTable.setItems(vm.tables().links());
        linkTable.setPlaceholder(new Label("no links above the planner's capacity floor"));
        linkTable.setId("link-table");
        fitColumns(linkTable);
        linkTable.getSelectionModel().selectedItemProperty().addListener((o, a, b) -> {
            if (!syncing && b != null) {
                syncing = true;
                vm.tables().selectedLinkProperty().set(b);
                syncing = false;
            }
        });
        vm.tables().selectedLinkProperty().addListener((o, a, b) -> {
            if (syncing) {
                return;
            }
            syncing = true;
            if (b == null) {
                linkTable.getSelectionModel().clearSelection();
            } else {
                int i = indexOf(b);
                if (i >= 0) {
                    linkTable.getSelectionModel().clearAndSelect(i);
                    linkTable.scrollTo(i);
                    showLinks.run();
                }
            }
            syncing = false;
        });
        vm.tables().links().addListener((ListChangeListener<LinkReport>) c -> {
            LinkReport sel = vm.tables().selectedLinkProperty().get();
            if (sel != null) {
                syncing = true;
                int i = indexOf(sel);
                if (i >= 0) {
                    linkTable.getSelectionModel().clearAndSelect(i);
                }
                syncing = false;
            }
        });

        routeTable.getColumns().addAll(List.of(
                text("from", RouteReport::from),
                text("to", RouteReport::to),
                text("hops", r -> r.reachable() ? String.join(" → ", r.hops()) : "unreachable"),
                number("bottleneck bit", RouteReport::bottleneckCapacityBits),
                text("bottleneck hop", r -> r.bottleneckFrom() == null ? "" : r.bottleneckFrom() + " → " + r.bottleneckTo()),
                number("end-to-end bit", RouteReport::endToEndCapacityBits),
                cell("rate bit/s", RouteReport::rateBitsPerS, TableText::routeRate),
                cell("shared bit/s", this::sharedRate, r -> r.reachable()
                        ? TableText.number(sharedRate(r), "not applicable: no shared rate") : TableText.routeRate(r)),
                cell("latency s", RouteReport::latencyS, TableText::latency),
                cell("direct bit", r -> r.directCapacityBits() == null ? Double.NaN : r.directCapacityBits(),
                        TableText::direct)));
        routeTable.setItems(vm.tables().routes());
        fitColumns(routeTable);
        routeTable.setPlaceholder(new Label("no demands"));
        routeTable.getSelectionModel().selectedItemProperty().addListener((o, a, b) -> {
            if (b != null) {
                vm.tables().selectedRouteProperty().set(b);
            }
        });

        budgetTable.getColumns().addAll(List.of(
                text("node", BudgetReport::node),
                cell("needed molecules/symbol", b -> (double) b.moleculesPerSymbolNeeded(), TableText::moleculesPerSymbol),
                cell("molecules/s", BudgetReport::moleculesPerS, TableText::moleculesPerS),
                cell("per mission", BudgetReport::moleculesPerMission, TableText::moleculesPerMission),
                text("feasible", b -> b.feasible() ? "yes" : "no"),
                text("reason", BudgetReport::reason)));
        budgetTable.setItems(vm.tables().budgets());
        budgetTable.setPlaceholder(new Label("no budgets"));
        fitColumns(budgetTable);
    }

    private Double sharedRate(RouteReport r) {
        var sh = vm.tables().sharedRate(r);
        return sh == null ? Double.NaN : sh.rateBitsPerS();
    }

    private int indexOf(LinkReport l) {
        for (int i = 0; i < linkTable.getItems().size(); i++) {
            LinkReport x = linkTable.getItems().get(i);
            if (x.from().equals(l.from()) && x.to().equals(l.to())) {
                return i;
            }
        }
        return -1;
    }

    Region routesPane() {
        TextArea advice = new TextArea();
        advice.setEditable(false);
        advice.setWrapText(true);
        advice.setPrefRowCount(4);
        advice.textProperty().bind(vm.routeSummary());
        VBox.setVgrow(routeTable, Priority.ALWAYS);
        return new VBox(6, routeTable, advice);
    }

    Region comparePane() {
        TableView<DemandComparison> t = new TableView<>(vm.tables().comparison());
        t.getColumns().addAll(List.of(
                text("from", DemandComparison::from),
                text("to", DemandComparison::to),
                number("kept bit", DemandComparison::baselineCapacity),
                number("now bit", DemandComparison::capacity),
                number("kept bit/s", DemandComparison::baselineRate),
                number("now bit/s", DemandComparison::rate),
                number("kept mol/bit", DemandComparison::baselineMolPerBit),
                number("now mol/bit", DemandComparison::molPerBit)));
        t.setPlaceholder(new Label("Press \"Keep for compare\", edit the layout, and compare here."));
        fitColumns(t);
        return t;
    }
}
