export default entityDeleteRoute('matchedSets')
