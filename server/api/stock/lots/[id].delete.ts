export default entityDeleteRoute('tubeLots')
